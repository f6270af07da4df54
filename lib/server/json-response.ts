import "server-only";
import { NextResponse } from "next/server";

/**
 * Below this size a JSON answer goes out as it is. The framework compresses every streamed response, and it
 * cannot see the length of a route handler's body, so the compressor's own 1 KB threshold never applies: a
 * 40-byte answer paid for a whole gzip stream (about 1.7 ms of CPU per sign-in, profiled under the benchmark).
 * `no-transform` tells the compressor, and any proxy, to leave these small bodies alone.
 *
 * 8 KB and not 1 KB: an answer this small goes out in the first flight of a new connection anyway (TCP's initial
 * window is 10 segments, about 14.6 KB: RFC 6928), and on a kept-alive one compressing it saves microseconds of
 * transfer for a gzip stream on the server and an inflate on the phone. The mix check's answer (about 1.6–1.9 KB,
 * half of every scan's requests) spent about half a millisecond of the server's main thread on gzip (profiled under
 * the benchmark's scan load).
 */
export const SMALL_JSON_BYTES = 8 * 1024;

/** `Response.json` with the small-body rule above; API answers are private and never cached. */
export function jsonResponse(data: unknown, init: ResponseInit = {}): NextResponse {
  const text = JSON.stringify(data);
  const headers = new Headers(init.headers);
  headers.set("Content-Type", "application/json");
  if (!headers.has("Cache-Control"))
    headers.set(
      "Cache-Control",
      Buffer.byteLength(text) < SMALL_JSON_BYTES ? "private, no-store, no-transform" : "private, no-store",
    );
  return new NextResponse(text, { ...init, headers });
}
