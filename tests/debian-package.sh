# Sourced by the test scripts: install a Debian package the tests need when it is missing,
# as CI does (it runs as root with no stdin), or say exactly what to install.
#   need_debian_package <label> [apt-get install options] <package> [more packages]
# Returns 0 when installed (or already there), exits 1 with instructions otherwise.
need_debian_package() {
  local label="$1"
  shift
  if [ "$(id -u)" = "0" ] && command -v apt-get >/dev/null; then
    echo "[$label] installing from Debian: apt-get install -y $*"
    export DEBIAN_FRONTEND=noninteractive
    if [ -z "${DUFFBANK_APT_UPDATED:-}" ]; then
      apt-get update -qq </dev/null
      export DUFFBANK_APT_UPDATED=1
    fi
    apt-get install -y -qq "$@" </dev/null >/dev/null
  else
    echo "[$label] missing. Install Debian's package as root: apt-get install -y $*" >&2
    return 1
  fi
}
