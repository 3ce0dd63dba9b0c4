// npm test: makes sure Debian's Chromium is present (installing it when running as root),
// builds the app once, then runs the unit, integration and browser test projects.
import { execSync, spawnSync } from "node:child_process";
import fs from "node:fs";

const CHROMIUM = process.env.CHROMIUM_PATH || "/usr/bin/chromium";

function run(cmd, args, env = {}) {
  const result = spawnSync(cmd, args, { stdio: "inherit", env: { ...process.env, ...env } });
  if (result.status !== 0) process.exit(result.status ?? 1);
}

if (!fs.existsSync(CHROMIUM)) {
  if (process.getuid?.() !== 0) {
    console.error(`[test] ${CHROMIUM} is missing. Install Debian's chromium package (apt-get install -y chromium).`);
    process.exit(1);
  }
  console.log("[test] installing Debian's chromium package…");
  execSync("apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium", { stdio: "inherit" });
}

run("npx", ["astro", "build"], { ASTRO_TELEMETRY_DISABLED: "1" });
run("npx", ["vitest", "run", ...process.argv.slice(2)], { CHROMIUM_PATH: CHROMIUM });
