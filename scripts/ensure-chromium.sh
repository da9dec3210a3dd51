#!/usr/bin/env bash
# Makes sure a Chromium for the browser tests is present. Debian's package is the supported one;
# CHROMIUM_PATH overrides the location. As root it installs the package; otherwise it says what to run.
set -euo pipefail
if [ -n "${CHROMIUM_PATH:-}" ]; then
  [ -x "$CHROMIUM_PATH" ] && exit 0
  echo "CHROMIUM_PATH=$CHROMIUM_PATH is not an executable file." >&2; exit 1
fi
[ -x /usr/lib/chromium/chromium ] && exit 0
if [ "$(id -u)" = "0" ] && command -v apt-get >/dev/null 2>&1; then
  echo "Chromium is missing: installing Debian's chromium package (about 120 MB)..."
  apt-get update -qq
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends chromium >/dev/null
  [ -x /usr/lib/chromium/chromium ] && exit 0
fi
cat >&2 <<'MSG'
The browser tests need Chromium, and it is not installed. Run, as root:
  apt-get update && DEBIAN_FRONTEND=noninteractive apt-get install -y --no-install-recommends chromium
or point CHROMIUM_PATH at a Chromium executable.
MSG
exit 1
