// The database floor of `npm run bench`: a plain Node HTTP server that runs, for each request, the SQL statements the
// app was seen to run for the same request (captured from MariaDB's general log), with the `mariadb` driver and no
// framework. Started as its own process so that it does not share the load generator's event loop.
// Usage: node bench-floor-server.mjs <port> <statements.json>; database settings from DATABASE_* in the environment.
import { readFileSync } from "node:fs";
import http from "node:http";
import mariadb from "mariadb";

const [port, file] = process.argv.slice(2);
/** @type {Record<string, string[]>} route name → statements */
const routes = JSON.parse(readFileSync(file, "utf8"));
const pool = mariadb.createPool({
  host: process.env.DATABASE_HOST,
  port: Number(process.env.DATABASE_PORT),
  user: process.env.DATABASE_USER,
  password: process.env.DATABASE_PASSWORD,
  database: process.env.DATABASE_NAME,
  connectionLimit: 10,
  bigIntAsNumber: true,
  decimalAsNumber: true,
});

const server = http.createServer(async (request, response) => {
  const name = (request.url ?? "/").slice(1);
  const statements = routes[name];
  if (!statements) {
    response.writeHead(404).end();
    return;
  }
  request.resume();
  try {
    const conn = await pool.getConnection();
    const out = [];
    try {
      for (const sql of statements) out.push(await conn.query(sql));
    } finally {
      conn.release();
    }
    const body = JSON.stringify(out.at(-1) ?? null);
    response.writeHead(200, { "content-type": "application/json" }).end(body);
  } catch (error) {
    process.stderr.write(`${name}: ${error.message}\n`);
    response.writeHead(500, { "content-type": "text/plain" }).end(String(error));
  }
});
server.listen(Number(port), "127.0.0.1", () => process.stdout.write("ready\n"));
process.on("SIGTERM", () => {
  server.close();
  pool.end().finally(() => process.exit(0));
});
