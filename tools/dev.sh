#!/bin/sh
# tools/dev.sh -- set up, build, demo and test molq on a Debian 12 machine.
#
#   tools/dev.sh demo    install what is missing, build, run the kiln demo
#   tools/dev.sh test    install what is missing, build, run the whole suite:
#                        plain build (with valgrind), the ABI check, again
#                        under AddressSanitizer + UndefinedBehaviorSanitizer,
#                        the threading test under ThreadSanitizer, the fuzz
#                        regressions and a short run of every fuzz target
#                        (FUZZ_SECONDS each, default 60)
#   tools/dev.sh setup   only install the Debian packages that are missing
#
# Package installation uses apt-get (as root, or through sudo when present).
set -eu

cd "$(dirname "$0")/.."

PACKAGES="gcc g++ meson ninja-build pkg-config libgsl-dev check libjansson-dev python3 valgrind abigail-tools clang libclang-rt-14-dev llvm-14"

setup() {
    missing=""
    for p in $PACKAGES; do
        dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q "ok installed" ||
            missing="$missing $p"
    done
    [ -z "$missing" ] && return 0
    echo "installing:$missing"
    if [ "$(id -u)" = 0 ]; then SUDO=""; else SUDO="sudo"; fi
    $SUDO apt-get update -qq
    DEBIAN_FRONTEND=noninteractive $SUDO apt-get install -y -qq $missing
}

build() { # build DIR [meson options...]
    dir=$1
    shift
    if [ -f "$dir/build.ninja" ]; then
        meson configure "$dir" "$@" >/dev/null
    else
        meson setup "$dir" "$@"
    fi
    ninja -C "$dir"
}

case "${1:-}" in
setup)
    setup
    ;;
demo)
    setup
    build build
    ./build/examples/kiln_recovery
    ;;
test)
    setup
    build build
    meson test -C build --print-errorlogs
    # The ABI may only grow: compare the built library with abi/libmolq.abi.
    abi/check.sh build
    # Sanitisers: the suites that load the library into an uninstrumented
    # host (Python via ctypes) or run it under valgrind are skipped here;
    # they run in the plain build above.  So is the install test: its
    # second build is a plain one whatever this build is.
    build build-asan -Db_sanitize=address,undefined -Db_lundef=false
    ASAN_OPTIONS=detect_leaks=1 UBSAN_OPTIONS=halt_on_error=1:print_stacktrace=1 \
        meson test -C build-asan --print-errorlogs --no-suite python --no-suite valgrind \
        --no-suite install
    # Threads under ThreadSanitizer (shared handles, concurrent creation).
    tests/hardening/tsan.sh build-tsan
    # Fuzzing: every committed regression input, then a short run per target.
    fuzz/regress.sh
    fuzz/run.sh "${FUZZ_SECONDS:-60}"
    ;;
*)
    echo "usage: tools/dev.sh demo|test|setup" >&2
    exit 2
    ;;
esac
