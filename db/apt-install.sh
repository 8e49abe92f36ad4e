# shellcheck shell=bash
# Installs Debian packages with apt-get, only the ones that are missing. Sourced by
# docker-free-start.sh and db/mariadb.sh.
#   mr_apt_install PACKAGE...   (runs apt-get update first when the package lists are empty,
#                                and once more when an install fails for stale lists)

mr_apt_run() {
  local -a sudo=()
  if [ "$(id -u)" -ne 0 ]; then
    if command -v sudo >/dev/null 2>&1; then
      sudo=(sudo)
    else
      echo "[millrace] error: installing $* needs root (or sudo); run as root or install them by hand." >&2
      return 1
    fi
  fi
  "${sudo[@]}" env DEBIAN_FRONTEND=noninteractive apt-get -o DPkg::Lock::Timeout=600 "$@"
}

mr_apt_lists_present() {
  compgen -G '/var/lib/apt/lists/*_Packages*' >/dev/null
}

mr_apt_install() {
  [ "$#" -gt 0 ] || return 0
  if ! command -v apt-get >/dev/null 2>&1; then
    echo "[millrace] error: $* missing and apt-get not found; this script expects Debian 12. Install them by hand." >&2
    return 1
  fi
  echo "[millrace] installing with apt-get: $*"
  if ! mr_apt_lists_present; then
    mr_apt_run update -qq || return 1
  fi
  if ! mr_apt_run install -y -qq "$@"; then
    echo "[millrace] apt-get install failed; refreshing the package lists and trying again"
    mr_apt_run update -qq || return 1
    mr_apt_run install -y -qq "$@" || return 1
  fi
}
