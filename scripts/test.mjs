// `npm test`: the same set-up as `npm start` on a throwaway MariaDB (random port, temporary folder) with its
// own mail fake and app server; then unit, integration and browser tests; then one line `N passed, N failed`.
import { mkdirSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { ensureDebianPackage, ensureNodeModules, root } from "./lib/setup.mjs";
import { newSecret, startApp, startDatabase, startMailFakeProcess } from "./lib/stack.mjs";
import { freePort, runStatus, say } from "./lib/util.mjs";

const artifacts = path.join(root, ".test-artifacts");
const stoppers = [];
let tmp;

async function cleanup() {
  for (const stop of stoppers.reverse()) await stop().catch(() => {});
  if (tmp) rmSync(tmp, { recursive: true, force: true });
}

function readJson(file) {
  try {
    return JSON.parse(readFileSync(file, "utf8"));
  } catch {
    return null;
  }
}

// `npm test -- tests/integration/x.test.ts tests/e2e/y.spec.ts` runs only those files (no typecheck or lint):
// a quicker loop while working. CI always runs everything.
const only = process.argv.slice(2).filter((a) => !a.startsWith("-"));
const onlyOf = (folder) => only.filter((f) => f.replace(/^\.\//, "").startsWith(`tests/${folder}/`));
const wanted = (folder) => only.length === 0 || onlyOf(folder).length > 0;

async function vitest(project, env) {
  const output = path.join(artifacts, `vitest-${project}.json`);
  rmSync(output, { force: true });
  const code = await runStatus(
    path.join(root, "node_modules", ".bin", "vitest"),
    [
      "run",
      "--project",
      project,
      "--reporter=default",
      "--reporter=json",
      `--outputFile=${output}`,
      ...onlyOf(project),
    ],
    { cwd: root, env },
  );
  const report = readJson(output);
  let passed = report?.numPassedTests ?? 0;
  // A file that failed to load has no failed test in it; count it once.
  const brokenFiles = (report?.testResults ?? []).filter(
    (file) => file.status === "failed" && !(file.assertionResults ?? []).some((t) => t.status === "failed"),
  ).length;
  let failed = (report?.numFailedTests ?? 0) + brokenFiles;
  if (code !== 0 && failed === 0) failed = 1; // the runner itself failed (a file did not load, no report)
  if (!report) passed = 0;
  return { name: `${project} (vitest)`, passed, failed };
}

/** A static check counts as one test: it passes or fails as a whole. */
async function check(name, command, args) {
  say(`${name}…`);
  const code = await runStatus(command, args, { cwd: root });
  return { name, passed: code === 0 ? 1 : 0, failed: code === 0 ? 0 : 1 };
}

async function playwright(env) {
  const output = path.join(artifacts, "playwright.json");
  rmSync(output, { force: true });
  const code = await runStatus(
    path.join(root, "node_modules", ".bin", "playwright"),
    ["test", ...onlyOf("e2e")],
    { cwd: root, env },
  );
  const stats = readJson(output)?.stats;
  const passed = (stats?.expected ?? 0) + (stats?.flaky ?? 0);
  let failed = stats?.unexpected ?? 0;
  if (code !== 0 && failed === 0) failed = 1;
  return { name: "browser (playwright)", passed, failed };
}

let exitCode = 1;
const results = [];
try {
  const started = Date.now();
  await ensureNodeModules();
  await ensureDebianPackage({ binary: "mariadbd", pkg: "mariadb-server", why: "the test database" });
  const chromium = await ensureDebianPackage({ binary: "chromium", pkg: "chromium", why: "browser tests" });
  mkdirSync(artifacts, { recursive: true });
  rmSync(path.join(artifacts, "screenshots"), { recursive: true, force: true });

  const baseEnv = { ...process.env, NODE_ENV: "test", NEXT_TELEMETRY_DISABLED: "1" };
  if (!only.length) {
    results.push(await check("typecheck", path.join(root, "node_modules", ".bin", "tsc"), ["--noEmit"]));
    results.push(
      await check("lint", path.join(root, "node_modules", ".bin", "eslint"), [".", "--max-warnings=0"]),
    );
  }
  if (wanted("unit")) results.push(await vitest("unit", baseEnv));

  if (wanted("integration") || wanted("e2e")) {
    tmp = mkdtempSync(path.join(os.tmpdir(), "gl-test-"));
    const [dbPort, smtpPort, inboxPort, appPort] = [
      await freePort(),
      await freePort(),
      await freePort(),
      await freePort(),
    ];
    say(`throwaway MariaDB on ${dbPort}, mail fake on ${smtpPort}/${inboxPort}, app on ${appPort}`);
    const { db, env, ownerEnv } = await startDatabase({
      baseDir: path.join(tmp, "db"),
      port: dbPort,
      database: "greaseledger_test",
      password: newSecret(),
      ownerPassword: newSecret(),
      reuse: false,
      seed: true,
    });
    stoppers.push(db.stop);
    const mail = await startMailFakeProcess({ smtpPort, httpPort: inboxPort, silent: true });
    stoppers.push(mail.stop);

    const appUrl = `http://127.0.0.1:${appPort}`;
    const appEnv = {
      ...env,
      APP_URL: appUrl,
      SMTP_HOST: "127.0.0.1",
      SMTP_PORT: String(smtpPort),
      MAIL_INBOX_URL: `http://127.0.0.1:${inboxPort}`,
      OUTBOX_POLL_MS: "300",
      UPLOAD_DIR: path.join(tmp, "uploads"),
    };
    const app = await startApp({ port: appPort, env: appEnv, silent: !process.env.GL_TEST_VERBOSE });
    stoppers.push(app.stop);

    const testEnv = {
      ...baseEnv,
      ...appEnv,
      ...ownerEnv,
      DATABASE_ROOT_SOCKET: db.socket,
      MAIL_FAKE_URL: `http://127.0.0.1:${inboxPort}`,
      CHROMIUM_PATH: chromium,
      GL_TEST_TMP: tmp,
      SCREENSHOT_DIR: path.join(artifacts, "screenshots"),
    };
    if (wanted("integration")) results.push(await vitest("integration", testEnv));
    if (wanted("e2e")) results.push(await playwright(testEnv));
  }
  // A tiny run of the benchmark, so `npm run bench` cannot rot (its figures mean nothing at this size).
  if (!only.length)
    results.push(
      await check("benchmark smoke run", process.execPath, [
        path.join(root, "scripts", "bench.mjs"),
        "--smoke",
      ]),
    );

  const passed = results.reduce((n, r) => n + r.passed, 0);
  const failed = results.reduce((n, r) => n + r.failed, 0);
  console.log("");
  for (const r of results) console.log(`  ${r.name}: ${r.passed} passed, ${r.failed} failed`);
  console.log(
    `  took ${Math.round((Date.now() - started) / 1000)} s; screenshots in .test-artifacts/screenshots`,
  );
  console.log(`${passed} passed, ${failed} failed`);
  exitCode = failed === 0 && passed > 0 ? 0 : 1;
} catch (error) {
  const passed = results.reduce((n, r) => n + r.passed, 0);
  const failed = results.reduce((n, r) => n + r.failed, 0) + 1;
  console.error(`\n[greaseledger] the test run could not complete: ${error.message}`);
  console.log(`${passed} passed, ${failed} failed`);
  exitCode = 1;
} finally {
  await cleanup();
}
process.exit(exitCode);
