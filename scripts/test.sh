#!/usr/bin/env bash
# npm test: every suite (unit, reference, api, e2e). Installs the Debian packages the suites need when they
# are missing and we run as root; otherwise stops with a message naming them.
set -euo pipefail
cd "$(dirname "$0")/.."

need=()
[ -x /usr/bin/chromium ] || need+=(chromium)
[ -f /usr/share/color/argyll/ref/D50.sp ] || [ -d /usr/share/colord ] || dpkg -s colord-data >/dev/null 2>&1 || need+=(colord-data)
dpkg -s colord-data >/dev/null 2>&1 || need+=(colord-data)
/usr/bin/python3 -c 'import colormath' >/dev/null 2>&1 || need+=(python3-colormath)
/usr/bin/python3 -c 'import numpy' >/dev/null 2>&1 || need+=(python3-numpy)
/usr/bin/python3 -c 'import scipy.optimize' >/dev/null 2>&1 || need+=(python3-scipy)
command -v spec2cie >/dev/null 2>&1 || need+=(argyll)
command -v pdftoppm >/dev/null 2>&1 || need+=(poppler-utils)
if [ ${#need[@]} -gt 0 ]; then
  mapfile -t need < <(printf '%s\n' "${need[@]}" | sort -u)
  if [ "$(id -u)" = 0 ] && command -v apt-get >/dev/null; then
    echo "Installing Debian packages the tests need: ${need[*]}"
    export DEBIAN_FRONTEND=noninteractive
    apt-get update -qq
    apt-get install -y -qq "${need[@]}" >/dev/null
  else
    echo "The tests need these Debian packages: ${need[*]}" >&2
    echo "Install them with: sudo apt-get install ${need[*]}" >&2
    exit 1
  fi
fi

echo "Building the client for the browser tests…"
npx vite build --logLevel warn

mkdir -p test-output
status=0
npx vitest run --reporter=default --reporter=json --outputFile.json=test-output/vitest.json "$@" || status=$?
node -e '
const r = JSON.parse(require("fs").readFileSync("test-output/vitest.json", "utf8"));
const by = {};
for (const f of r.testResults) for (const t of f.assertionResults) {
  const p = f.name.split("/tests/")[1]?.split("/")[0] ?? "?";
  by[p] ??= { passed: 0, failed: 0, skipped: 0 };
  if (t.status === "passed") by[p].passed++; else if (t.status === "failed") by[p].failed++; else by[p].skipped++;
}
for (const [k, v] of Object.entries(by)) console.log(`suite ${k}: ${v.passed} passed, ${v.failed} failed, ${v.skipped} skipped`);
console.log(`${r.numPassedTests} passed, ${r.numFailedTests} failed` + (r.numPendingTests ? `, ${r.numPendingTests} skipped` : ""));
if (r.numTotalTests === 0) { console.error("no test ran"); process.exit(1); }
' || status=1
exit $status
