# Installs the Debian packages mudepth needs, only those missing. Sourced by
# tests/run.sh and examples/demo.sh; uses sudo when not root.
# Usage: mudepth_install_deps build|test
mudepth_install_deps() {
    local packages=(cmake make g++ pkg-config libboost-math-dev libboost-dev libeigen3-dev
                    libcli11-dev nlohmann-json3-dev libtomlplusplus-dev)
    if [ "${1:-build}" = test ]; then
        packages+=(libgtest-dev libxrl-dev python3-periodictable librsvg2-bin clang-14 libclang-rt-14-dev
                   pybind11-dev python3-dev python3-numpy python3-pytest)
    fi
    local missing=()
    for p in "${packages[@]}"; do
        dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q "install ok installed" || missing+=("$p")
    done
    [ ${#missing[@]} -eq 0 ] && return 0
    echo "installing: ${missing[*]}"
    local sudo=""
    [ "$(id -u)" -ne 0 ] && sudo="sudo"
    $sudo apt-get update -qq
    DEBIAN_FRONTEND=noninteractive $sudo apt-get install -y -qq --no-install-recommends "${missing[@]}"
}
