#!/usr/bin/env bash
# Install the Debian/Ubuntu packages given as arguments that are not installed yet.
# Uses sudo when not root. Prints nothing when everything is already there.
set -euo pipefail
if ! command -v go >/dev/null 2>&1 && [ ! -x /usr/local/go/bin/go ]; then
  echo "Go is not installed: install Go 1.24 or newer (https://go.dev/doc/install), then run again" >&2
  exit 1
fi
missing=()
for p in "$@"; do
  dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q 'install ok installed' || missing+=("$p")
done
[ ${#missing[@]} -eq 0 ] && exit 0
sudo=""
[ "$(id -u)" -ne 0 ] && sudo="sudo"
echo "installing: ${missing[*]}"
$sudo apt-get update -qq
DEBIAN_FRONTEND=noninteractive $sudo apt-get install -y -qq --no-install-recommends "${missing[@]}"
