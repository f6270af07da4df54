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
  return QRCode.toString(tagUrl(tag), { type: "svg", errorCorrectionLevel: "Q", margin: 4 });
}

export function tagQrPng(tag: string, width = 480): Promise<Buffer> {
  return QRCode.toBuffer(tagUrl(tag), { type: "png", errorCorrectionLevel: "Q", margin: 4, width });
}

/** The URL a container label's QR code carries: /c/<label code>, which opens the lot. */
export function containerUrl(code: string): string {
  return new URL(`/c/${code}`, getEnv().APP_URL).toString();
}

export function parseLabelParam(raw: string | undefined): string {
  const code = raw ? normaliseTagCode(raw) : null;
  if (!code) throw new NotFoundError("Not a container label code.");
  return code;
}

export function containerQrSvg(code: string): Promise<string> {
  return QRCode.toString(containerUrl(code), { type: "svg", errorCorrectionLevel: "Q", margin: 4 });
}

export function containerQrPng(code: string, width = 480): Promise<Buffer> {
  return QRCode.toBuffer(containerUrl(code), { type: "png", errorCorrectionLevel: "Q", margin: 4, width });
}
