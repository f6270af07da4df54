import "server-only";
import QRCode from "qrcode";
import { normaliseTagCode } from "@/lib/domain/service";
import { getEnv } from "@/lib/env";
import { NotFoundError } from "./errors";

/** The URL a tag's QR code carries: short, so the code stays coarse enough for a worn tag and a phone camera. */
export function tagUrl(tag: string): string {
  return new URL(`/p/${tag}`, getEnv().APP_URL).toString();
}

export function parseTagParam(raw: string | undefined): string {
  const tag = raw ? normaliseTagCode(raw) : null;
  if (!tag) throw new NotFoundError("Not a lube-point tag code.");
  return tag;
}

export function tagQrSvg(tag: string): Promise<string> {
  return QRCode.toString(tagUrl(tag), { type: "svg", errorCorrectionLevel: "Q", margin: 2 });
}

export function tagQrPng(tag: string, width = 480): Promise<Buffer> {
  return QRCode.toBuffer(tagUrl(tag), { type: "png", errorCorrectionLevel: "Q", margin: 2, width });
}
