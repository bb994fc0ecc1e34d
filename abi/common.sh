# abi/common.sh -- shared by abi/check.sh and abi/update.sh (sourced, not run).
#
# Sets: ABI_DIR, ROOT, BASELINE, and provides
#   abi_need_tools TOOL...      exit 2 with an install hint if a tool is missing
#   abi_resolve_build DIR       sets BUILD, SRC (source tree of that build), LIB
#   abi_require_debug_info      exit 2 unless LIB carries DWARF
#   abi_soname FILE             print the DT_SONAME of an ELF file
#   abi_experimental_suppr OUT  write an abigail suppression file naming the
#                               functions declared after #ifdef MOLQ_EXPERIMENTAL
#                               in $SRC/include/molq/molq.h

ABI_DIR=$(cd "$(dirname "$0")" && pwd)
ROOT=$(dirname "$ABI_DIR")
BASELINE="$ABI_DIR/libmolq.abi"

abi_die() { # code message...
    code=$1
    shift
    echo "abi: $*" >&2
    exit "$code"
}

abi_need_tools() {
    for t in "$@"; do
        if ! command -v "$t" >/dev/null 2>&1; then
            case $t in
            abidw | abidiff) pkg=abigail-tools ;;
            readelf) pkg=binutils ;;
            *) pkg=$t ;;
            esac
            abi_die 2 "'$t' not found. Install it with: apt-get install $pkg" \
                "(tools/dev.sh setup installs it once '$pkg' is in its PACKAGES list)"
        fi
    done
}

abi_resolve_build() {
    BUILD=${1:-$ROOT/build}
    [ -d "$BUILD" ] || abi_die 2 "build directory '$BUILD' does not exist" \
        "(configure and build it first: meson setup $BUILD && ninja -C $BUILD)"
    BUILD=$(cd "$BUILD" && pwd)
    # The source tree this build was configured from (its public headers are
    # the ones that describe the library in it).
    SRC=""
    info="$BUILD/meson-info/meson-info.json"
    if [ -f "$info" ]; then
        SRC=$(sed -n 's/.*"source": *"\([^"]*\)".*/\1/p' "$info" | head -n 1)
    fi
    [ -n "$SRC" ] && [ -f "$SRC/include/molq/molq.h" ] || SRC=$ROOT
    # libmolq.so is the development link meson points at the current
    # libmolq.so.MAJOR.MINOR.PATCH; older versions may linger beside it.
    LIB=""
    if [ -e "$BUILD/lib/libmolq.so" ]; then
        LIB=$(readlink -f "$BUILD/lib/libmolq.so")
    else
        for f in "$BUILD"/lib/libmolq.so.*.*; do
            [ -f "$f" ] && [ ! -L "$f" ] && LIB=$f
        done
    fi
    [ -n "$LIB" ] && [ -f "$LIB" ] || abi_die 2 "no shared library in $BUILD/lib" \
        "(build it first: ninja -C $BUILD)"
}

abi_require_debug_info() {
    readelf -S --wide "$LIB" | grep -q '\.debug_info' ||
        abi_die 2 "$LIB has no debug info, so the types of the API cannot be" \
            "compared. Use a build with -g (buildtype debugoptimized, the default" \
            "here, or debug)."
}

abi_soname() {
    readelf -d --wide "$1" | sed -n 's/.*(SONAME).*\[\(.*\)\].*/\1/p'
}

abi_experimental_suppr() { # OUT
    # Names of functions declared between "#ifdef MOLQ_EXPERIMENTAL" and its
    # matching #endif; nested #if/#endif pairs are counted.
    names=$(awk '
        /^[ \t]*#[ \t]*if(def)?[ \t]+(defined[ \t]*\(?[ \t]*)?MOLQ_EXPERIMENTAL([^A-Za-z0-9_]|$)/ {
            if (!depth) { depth = 1; next }
        }
        depth && /^[ \t]*#[ \t]*if/ { depth++ }
        depth && /^[ \t]*#[ \t]*endif/ { depth--; next }
        depth { print }
    ' "$SRC/include/molq/molq.h" | tr '\n' ' ' |
        grep -o 'MOLQ_API[^;(]*\bmolq_[A-Za-z0-9_]*[ \t]*(' |
        sed 's/.*\(molq_[A-Za-z0-9_]*\)[ \t]*(/\1/' | sort -u)
    : >"$1"
    for n in $names; do
        printf '[suppress_function]\n  symbol_name = %s\n  drop = yes\n\n' "$n" >>"$1"
    done
    EXPERIMENTAL_NAMES=$names
}
