#!/bin/sh
# fuzz/build.sh -- build molq's libFuzzer targets with clang, apart from the
# meson build (a gcc-only machine builds the project without ever running
# this).
#
#   fuzz/build.sh            build into build-fuzz/ (or $MOLQ_FUZZ_BUILD)
#   fuzz/build.sh --force    rebuild even if nothing changed
#
# The library is compiled from the sources listed in lib/meson.build (so new
# lib/ files are picked up without editing this script), the built-in data
# file is generated with tools/embed_json.py as the meson build does, and
# every object is instrumented for libFuzzer coverage, AddressSanitizer and
# UndefinedBehaviorSanitizer.  Installs nothing: if clang or its fuzzer
# runtime is missing it says which Debian packages to add and exits 2.
set -eu

cd "$(dirname "$0")/.."
ROOT=$(pwd)
B=${MOLQ_FUZZ_BUILD:-build-fuzz}
case $B in /*) ;; *) B="$ROOT/$B" ;; esac
CC=${FUZZ_CC:-clang}
TARGETS="species_file cli_numbers spec_api"
FORCE=0
[ "${1:-}" = "--force" ] && FORCE=1

die_missing() {
    echo "fuzz/build.sh: $1" >&2
    echo "fuzz/build.sh: the fuzz build needs the Debian packages: clang libclang-rt-14-dev (and llvm-14 for symbolised stack traces), plus the project's own libjansson-dev libgsl-dev pkg-config python3" >&2
    exit 2
}

command -v "$CC" >/dev/null 2>&1 || die_missing "'$CC' not found on PATH"
command -v python3 >/dev/null 2>&1 || die_missing "python3 not found on PATH"
command -v pkg-config >/dev/null 2>&1 || die_missing "pkg-config not found on PATH"
pkg-config --exists jansson gsl || die_missing "pkg-config cannot find jansson and gsl"

mkdir -p "$B/obj"

# One build at a time in a build directory (run.sh calls started together).
if command -v flock >/dev/null 2>&1; then
    exec 9>"$B/.lock"
    flock 9
fi

# Does this clang have the libFuzzer and sanitizer runtimes?
if [ ! -f "$B/.toolchain-ok" ]; then
    printf '#include <stddef.h>\n#include <stdint.h>\nint LLVMFuzzerTestOneInput(const uint8_t *d, size_t n) { (void)d; (void)n; return 0; }\n' \
        >"$B/probe.c"
    if ! "$CC" -fsanitize=fuzzer,address,undefined "$B/probe.c" -o "$B/probe" \
        >"$B/probe.log" 2>&1; then
        cat "$B/probe.log" >&2
        die_missing "'$CC' cannot link a libFuzzer target (fuzzer/sanitizer runtime missing?)"
    fi
    rm -f "$B/probe" "$B/probe.c" "$B/probe.log"
    touch "$B/.toolchain-ok"
fi

# Up to date?  Anything that goes into the targets newer than the stamp
# (or a missing target) means a full rebuild; it takes well under a minute.
if [ "$FORCE" = 0 ] && [ -f "$B/.stamp" ]; then
    stale=$(find lib include tools/args.c tools/args.h tools/embed_json.py \
        data/species fuzz -newer "$B/.stamp" \( -name '*.c' -o -name '*.h' \
        -o -name '*.py' -o -name '*.json' -o -name 'meson.build' -o -name '*.sh' \) \
        -print 2>/dev/null | head -n 1)
    for t in $TARGETS; do [ -x "$B/$t" ] || stale=yes; done
    if [ -z "$stale" ]; then
        exit 0
    fi
fi
rm -f "$B/.stamp"

# Library sources: every quoted *.c named in a meson.build under lib/ that
# exists beside it (this skips generated outputs such as builtin_data.c).
SRCS=$(for mb in $(find lib -name meson.build); do
    d=$(dirname "$mb")
    grep -o "'[^']*\.c'" "$mb" | tr -d "'" | while read -r f; do
        [ -f "$d/$f" ] && echo "$d/$f"
    done
done | sort -u)
[ -n "$SRCS" ] || { echo "fuzz/build.sh: no sources found in lib/meson.build" >&2; exit 1; }

python3 tools/embed_json.py "$B/builtin_data.c" "$B/builtin_species.json" \
    data/species/*.json

# Public functions that may not exist yet in every checkout: the targets
# call them only when molq.h declares them.
FEATURES=""
for f in molq_spec_set_top_weights molq_spec_set_top_spin_group \
         molq_spec_set_spin_orbit; do
    grep -q "$f(" include/molq/molq.h && FEATURES="$FEATURES -DMOLQ_FUZZ_HAVE_$f"
done

SAN="-fsanitize=address,undefined -fno-sanitize-recover=undefined"
CFLAGS="-std=c11 -D_POSIX_C_SOURCE=200809L -g -O1 -fno-omit-frame-pointer $SAN"
LIBCFLAGS="$CFLAGS -fsanitize=fuzzer-no-link -DMOLQ_BUILDING_LIBRARY -Iinclude -Ilib $(pkg-config --cflags jansson gsl)"
LIBS="$(pkg-config --libs jansson gsl) -lm"

rm -f "$B"/obj/*.o
echo "fuzz/build.sh: compiling $(echo "$SRCS" | wc -l) library sources with $CC into $B"
# Two at a time (the machine has 2 cores); `xargs` stops on the first error.
# The object name keeps the directory (api/species.c and species/species.c).
{ echo "$SRCS"; echo "$B/builtin_data.c"; } | xargs -P 2 -I{} sh -c \
    'o=$(echo "{}" | sed "s|^$1/||; s|/|_|g; s|\.c$|.o|"); exec '"$CC"' '"$LIBCFLAGS"' -c "{}" -o "$1/obj/$o"' \
    sh "$B"
# The CLI's argument parser is linked into cli_numbers only.
$CC $CFLAGS -fsanitize=fuzzer-no-link -Itools -c tools/args.c -o "$B/args.o"
rm -f "$B/libmolq_fuzz.a"
ar rcs "$B/libmolq_fuzz.a" "$B"/obj/*.o

for t in $TARGETS; do
    extra=""
    [ "$t" = cli_numbers ] && extra="$B/args.o"
    $CC $CFLAGS $FEATURES -fsanitize=fuzzer -Iinclude -Itools "fuzz/$t.c" $extra \
        "$B/libmolq_fuzz.a" $LIBS -o "$B/$t"
done
touch "$B/.stamp"
echo "fuzz/build.sh: built $(for t in $TARGETS; do printf '%s ' "$B/$t"; done)"
