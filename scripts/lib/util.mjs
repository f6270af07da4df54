// Process helpers for the start, test and bench scripts. Node built-ins only: these run before
// node_modules exists.
import { spawn } from "node:child_process";
import { accessSync, constants } from "node:fs";
import net from "node:net";
import path from "node:path";

export const say = (message) => process.stdout.write(`[greaseledger] ${message}\n`);

/** Runs a command to completion; rejects on a non-zero exit. `quiet` captures output and shows it only on failure. */
export function run(command, args, { env, cwd, quiet = false, input } = {}) {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, {
      cwd,
      env: env ?? process.env,
      stdio: [input === undefined ? "ignore" : "pipe", quiet ? "pipe" : "inherit", quiet ? "pipe" : "inherit"],
    });
    let output = "";
    child.stdout?.on("data", (d) => (output += d));
    child.stderr?.on("data", (d) => (output += d));
    if (input !== undefined) {
      child.stdin.end(input);
    }
    child.on("error", reject);
    child.on("close", (code) => {
      if (code === 0) resolve(output);
      else {
        const error = new Error(`${command} ${args.join(" ")} exited with ${code}${quiet ? `\n${output.slice(-4000)}` : ""}`);
        error.exitCode = code;
        error.output = output;
        reject(error);
      }
    });
  });
}

/** Runs a command and resolves with its exit code (never rejects on a non-zero exit). */
export function runStatus(command, args, options = {}) {
  return run(command, args, options).then(
    () => 0,
    (error) => (typeof error.exitCode === "number" ? error.exitCode : 1),
  );
}

/** Finds an executable on PATH or in the sbin folders Debian keeps server binaries in. */
export function which(name) {
  const dirs = [...(process.env.PATH ?? "").split(path.delimiter), "/usr/sbin", "/sbin", "/usr/local/sbin"];
  for (const dir of dirs) {
    if (!dir) continue;
    const candidate = path.join(dir, name);
    try {
      accessSync(candidate, constants.X_OK);
      return candidate;
    } catch {
      /* keep looking */
    }
  }
  return null;
}

export const isRoot = () => typeof process.getuid === "function" && process.getuid() === 0;

/** A TCP port nobody listens on right now. */
export function freePort() {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.unref();
    server.on("error", reject);
    server.listen(0, "127.0.0.1", () => {
      const { port } = server.address();
      server.close(() => resolve(port));
    });
  });
}

/** Whether something accepts TCP connections on 127.0.0.1:port. */
export function portInUse(port) {
  return new Promise((resolve) => {
    const socket = net.connect({ port, host: "127.0.0.1" });
    socket.once("connect", () => {
      socket.destroy();
      resolve(true);
    });
    socket.once("error", () => resolve(false));
  });
}

export async function waitFor(check, { timeoutMs = 30_000, intervalMs = 100, what = "condition" } = {}) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    try {
      if (await check()) return;
    } catch {
      /* not yet */
    }
    if (Date.now() > deadline) throw new Error(`Timed out after ${timeoutMs} ms waiting for ${what}`);
    await new Promise((r) => setTimeout(r, intervalMs));
  }
}

/** Waits until an HTTP URL answers with any status below 500. */
export function waitForHttp(url, options = {}) {
  return waitFor(
    async () => {
      const response = await fetch(url, { signal: AbortSignal.timeout(2000) });
      return response.status < 500;
    },
    { what: url, ...options },
  );
}

/** Starts a long-running child and returns it; its output is prefixed so logs stay readable. */
export function startChild(name, command, args, { env, cwd, silent = false } = {}) {
  const child = spawn(command, args, { cwd, env: env ?? process.env, stdio: ["ignore", "pipe", "pipe"] });
  const prefix = (stream, target) => {
    let buffer = "";
    stream.on("data", (chunk) => {
      buffer += chunk;
      let index;
      while ((index = buffer.indexOf("\n")) >= 0) {
        const line = buffer.slice(0, index);
        buffer = buffer.slice(index + 1);
        if (!silent) target.write(`[${name}] ${line}\n`);
        child.emit("line", line);
      }
    });
  };
  prefix(child.stdout, process.stdout);
  prefix(child.stderr, process.stderr);
  return child;
}

/** Stops a child with SIGTERM, then SIGKILL after a grace period. */
export function stopChild(child, graceMs = 5000) {
  return new Promise((resolve) => {
    if (!child || child.exitCode !== null || child.signalCode !== null) return resolve();
    const timer = setTimeout(() => child.kill("SIGKILL"), graceMs);
    child.once("exit", () => {
      clearTimeout(timer);
      resolve();
    });
    child.kill("SIGTERM");
  });
}
