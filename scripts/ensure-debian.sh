#!/usr/bin/env bash
# Install Debian packages the project needs when they are missing.
# Usage: scripts/ensure-debian.sh PACKAGE...
# A temporary policy-rc.d keeps packages (mariadb-server) from starting their
# own services at install time; we run our own instances.
set -euo pipefail
export PATH="/usr/sbin:/sbin:$PATH"
missing=()
for pkg in "$@"; do
  if ! dpkg-query -W -f='${Status}' "$pkg" 2>/dev/null | grep -q "install ok installed"; then
    missing+=("$pkg")
  fi
done
[ ${#missing[@]} -eq 0 ] && exit 0
echo "installing Debian packages: ${missing[*]}" >&2
sudo=""
[ "$(id -u)" -ne 0 ] && sudo="sudo"
created_policy=0
if [ ! -e /usr/sbin/policy-rc.d ]; then
  printf '#!/bin/sh\nexit 101\n' | $sudo tee /usr/sbin/policy-rc.d >/dev/null
  $sudo chmod +x /usr/sbin/policy-rc.d
  created_policy=1
fi
cleanup() { [ "$created_policy" = 1 ] && $sudo rm -f /usr/sbin/policy-rc.d; }
trap cleanup EXIT
$sudo apt-get -o DPkg::Lock::Timeout=600 update -qq >&2 || true
DEBIAN_FRONTEND=noninteractive $sudo apt-get -o DPkg::Lock::Timeout=600 install -y -qq --no-install-recommends "${missing[@]}" >&2
