#!/bin/sh
# abi/update.sh [BUILD_DIR] -- regenerate the ABI baseline abi/libmolq.abi
# from an already-built build directory (default: build).
#
# This is a deliberate step, not a fix for a failing abi/check.sh.  Run it
#   - after a release, so the next release is checked against what shipped
#     (additions made since the last baseline become part of the promise);
#   - or as part of a deliberate major-version break (see abi/README.md).
# Build from a clean checkout of the commit you mean to record, with debug
# info (the default buildtype debugoptimized has it), then commit the new
# baseline together with the reason (CHANGELOG entry).
#
# Functions declared after "#ifdef MOLQ_EXPERIMENTAL" in the public header
# are left out of the baseline: they are outside the promise.
set -eu
. "$(dirname "$0")/common.sh"

abi_need_tools abidw readelf
abi_resolve_build "${1:-}"
abi_require_debug_info

suppr=$(mktemp)
out=$(mktemp)
trap 'rm -f "$suppr" "$out"' EXIT
abi_experimental_suppr "$suppr"

# --headers-dir + --drop-private-types: only types declared in the public
#   header are described (the opaque handles stay declaration-only);
# --exported-interfaces-only: only what the library exports;
# --no-corpus-path / --no-comp-dir-path / --type-id-style hash: no machine
#   paths, and the same bytes whatever directory the build lives in.
abidw --headers-dir "$SRC/include/molq" --drop-private-types \
    --exported-interfaces-only --no-corpus-path --no-comp-dir-path \
    --type-id-style hash --suppressions "$suppr" \
    --out-file "$out" "$LIB"

soname=$(sed -n "1s/.*soname='\([^']*\)'.*/\1/p" "$out")
[ "$soname" = "$(abi_soname "$LIB")" ] && [ -n "$soname" ] ||
    abi_die 1 "abidw output has no soname matching $LIB; baseline not written"
nfun=$(grep -c "<function-decl .*elf-symbol-id=" "$out" || true)
cp "$out" "$BASELINE"
echo "abi: wrote $BASELINE"
echo "abi: soname $soname, $nfun public functions, from $LIB"
if [ -n "$EXPERIMENTAL_NAMES" ]; then
    echo "abi: left out (experimental):" $EXPERIMENTAL_NAMES
fi
echo "abi: review 'git diff abi/libmolq.abi' and commit it with a CHANGELOG entry"
