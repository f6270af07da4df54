// The load generator's HTTP client for `npm run bench` and `npm run soak`: node:http on kept-alive sockets.
//
// The load generator shares the machine's two cores with the app and the database, so every millisecond it spends
// is taken from what it measures. `fetch` (undici) spent 0.4–0.6 ms of CPU per small request here, node:http about
// 0.12 ms (a trivial server, 16 at once, the same machine); the difference went to the request that did the most
// work, since the floor's trivial route is bound by the app's one main thread, not by the cores.
import http from "node:http";
import { gunzipSync } from "node:zlib";

const agent = new http.Agent({ keepAlive: true, maxSockets: Infinity });

/**
 * Sends one request and reads the whole answer: `{ status, headers, text, setCookies }`. Asks for gzip, as a phone's
 * browser does, unless the caller's headers say otherwise, and unpacks it. A kept-alive socket the server closed
 * while idle is retried once on a fresh one, as Node's documentation advises (`request.reusedSocket`).
 */
export function send(url, { method = "GET", headers = {}, body } = {}) {
  const payload = body === undefined ? undefined : Buffer.from(body);
  const once = () =>
    new Promise((resolve, reject) => {
      const request = http.request(
        url,
        {
          method,
          agent,
          headers: {
            "accept-encoding": "gzip",
            ...headers,
            ...(payload ? { "content-length": payload.length } : {}),
          },
        },
        (response) => {
          const chunks = [];
          response.on("data", (chunk) => chunks.push(chunk));
          response.on("error", reject);
          response.on("end", () => {
            let raw = Buffer.concat(chunks);
            if (response.headers["content-encoding"] === "gzip") raw = gunzipSync(raw);
            resolve({
              status: response.statusCode,
              headers: response.headers,
              text: raw.toString("utf8"),
              setCookies: response.headers["set-cookie"] ?? [],
            });
          });
        },
      );
      request.on("error", (error) => {
        error.reusedSocket = request.reusedSocket;
        reject(error);
      });
      request.end(payload);
    });
  return once().catch((error) => {
    if (error.reusedSocket && error.code === "ECONNRESET") return once();
    throw error;
  });
}
