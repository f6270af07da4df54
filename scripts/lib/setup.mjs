// Installing what is missing: npm packages, Debian packages, and the production build.
import { createHash } from "node:crypto";
import { existsSync, readFileSync, readdirSync, statSync, writeFileSync, mkdirSync } from "node:fs";
import path from "node:path";
import { isRoot, run, say, which } from "./util.mjs";

export const root = path.resolve(path.dirname(new URL(import.meta.url).pathname), "..", "..");

function sha(data) {
  return createHash("sha256").update(data).digest("hex");
}

/** Installs npm packages when node_modules is missing or older than package-lock.json. */
export async function ensureNodeModules() {
  const lock = path.join(root, "package-lock.json");
  const marker = path.join(root, "node_modules", ".greaseledger-lock-hash");
  const wanted = sha(readFileSync(existsSync(lock) ? lock : path.join(root, "package.json")));
  if (existsSync(marker) && readFileSync(marker, "utf8") === wanted) return;
  say("installing npm packages (node_modules is missing or stale)…");
  const args = existsSync(lock) ? ["ci", "--no-audit", "--no-fund"] : ["install", "--no-audit", "--no-fund"];
  // The registry sometimes drops a download (seen: EIDLETIMEOUT on one package); npm's own retries do not cover an
  // idle body, so the whole install is tried again, up to three times.
  for (let attempt = 1; ; attempt++) {
    try {
      await run("npm", args, {
        cwd: root,
        env: { ...process.env, NEXT_TELEMETRY_DISABLED: "1", npm_config_fetch_retries: "5" },
      });
      break;
    } catch (error) {
      if (attempt >= 3) throw error;
      say(`npm ${args[0]} failed (${error.message}); trying again (${attempt + 1} of 3)…`);
      await new Promise((resolve) => setTimeout(resolve, 5000 * attempt));
    }
  }
  writeFileSync(marker, wanted);
}

let aptUpdated = false;

/** Makes sure a Debian package's binary exists, installing the package with apt when we are root. */
export async function ensureDebianPackage({ binary, pkg, why }) {
  if (which(binary)) return which(binary);
  if (!isRoot()) {
    throw new Error(`${binary} is missing: run \`sudo apt-get install -y ${pkg}\` (${why}), then try again.`);
  }
  say(`installing ${pkg} from Debian's packages (${why})…`);
  const env = { ...process.env, DEBIAN_FRONTEND: "noninteractive" };
  if (!aptUpdated) {
    await run("apt-get", ["update", "-qq"], { env, quiet: true });
    aptUpdated = true;
  }
  await run("apt-get", ["install", "-y", "-qq", "--no-install-recommends", pkg], { env, quiet: true });
  const found = which(binary);
  if (!found) throw new Error(`${pkg} was installed but ${binary} is still not found`);
  return found;
}

const BUILD_INPUTS = [
  "app",
  "components",
  "lib",
  "models",
  "public",
  "instrumentation.ts",
  "proxy.ts",
  "next.config.mjs",
  "tailwind.config.ts",
  "postcss.config.mjs",
  "tsconfig.json",
  "package-lock.json",
];

function fingerprint() {
  const hash = createHash("sha256");
  const visit = (relative) => {
    const full = path.join(root, relative);
    if (!existsSync(full)) return;
    const stat = statSync(full);
    if (stat.isDirectory()) {
      for (const entry of readdirSync(full).sort()) visit(path.join(relative, entry));
    } else {
      hash.update(relative);
      hash.update(readFileSync(full));
    }
  };
  BUILD_INPUTS.forEach(visit);
  return hash.digest("hex");
}

/** Runs `next build` when there is no build or the sources changed since the last one. */
export async function ensureBuild(env) {
  const marker = path.join(root, ".next", "greaseledger-fingerprint");
  const wanted = fingerprint();
  if (
    existsSync(marker) &&
    readFileSync(marker, "utf8") === wanted &&
    existsSync(path.join(root, ".next", "BUILD_ID"))
  ) {
    say("production build is up to date");
    return;
  }
  say("building the app (next build)…");
  const started = Date.now();
  await run(path.join(root, "node_modules", ".bin", "next"), ["build"], {
    cwd: root,
    env: { ...env, NEXT_TELEMETRY_DISABLED: "1", NODE_ENV: "production" },
  });
  mkdirSync(path.dirname(marker), { recursive: true });
  writeFileSync(marker, wanted);
  say(`build finished in ${Math.round((Date.now() - started) / 1000)} s`);
}

/** Runs the TypeScript database script (migrate, seed) with the given environment. */
export function dbScript(args, env) {
  return run(
    path.join(root, "node_modules", ".bin", "tsx"),
    ["--conditions=react-server", "scripts/db.ts", ...args],
    {
      cwd: root,
      env,
    },
  );
}
