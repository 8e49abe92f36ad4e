#!/usr/bin/env bash
# Fetches the Netlib LP samples (Debian package coinor-libcoinutils-dev) and the table of published
# optima (Debian package glpk-doc) into a cache, without installing anything on the system:
#   apt-get download <pkg>  +  dpkg -x <deb> <cache>/root
# Idempotent and fast when cached. Cache directory: $LP_CORE_NETLIB_CACHE or <repo>/.cache/netlib.
# Prints the extraction root on stdout.
set -euo pipefail

here="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)"
repo="$(cd "$here/../../../.." && pwd)"
cache="${LP_CORE_NETLIB_CACHE:-$repo/.cache/netlib}"
root="$cache/root"
sample="$root/usr/share/coin/Data/Sample"
table="$root/usr/share/doc/glpk-doc/netlib.txt.gz"

if [[ -f "$sample/afiro.mps" || -f "$sample/afiro.mps.gz" ]] && [[ -f "$table" ]]; then
  echo "$root"
  exit 0
fi

mkdir -p "$cache"
exec 9>"$cache/.lock"
flock 9
# Another process may have finished the work while we waited for the lock.
if [[ -f "$sample/afiro.mps" || -f "$sample/afiro.mps.gz" ]] && [[ -f "$table" ]]; then
  echo "$root"
  exit 0
fi

cd "$cache"
packages=(coinor-libcoinutils-dev glpk-doc)
if ! apt-get download "${packages[@]}" >&2 2>/dev/null; then
  echo "fetch-netlib: apt-get download failed, running apt-get update once and retrying" >&2
  apt-get update -qq >&2
  apt-get download "${packages[@]}" >&2
fi
mkdir -p "$root"
for deb in coinor-libcoinutils-dev_*.deb glpk-doc_*.deb; do
  dpkg -x "$deb" "$root"
done
rm -f coinor-libcoinutils-dev_*.deb glpk-doc_*.deb
echo "$root"
