#!/bin/sh
# abi/update.sh [--allow-change] [BUILD_DIR] -- regenerate the ABI baseline
# abi/libmolq.abi from an already-built build directory (default: build).
#
# Run it
#   - in the commit that adds to the API (a function, an enumeration, an
#     enumerator): abi/check.sh fails until the baseline records it, so
#     every addition is under the check from its first commit on; when
#     merging branches that each add to the API, on the merged result;
#   - as part of a deliberate major-version break (see abi/README.md).
# It is not a fix for a check that reports a change: unless the soname
# changed, it refuses to write a baseline in which something the old one
# recorded was removed or changed (abidiff --no-added-syms finds a
# difference).  --allow-change overrides that, for a change a review has
# shown to be compatible (abi/README.md, "When it fails", step 4); say why
# in the commit message.
# Build with debug info (the default buildtype debugoptimized has it), then
# commit the new baseline together with the change that needed it.
#
# Functions declared after "#ifdef MOLQ_EXPERIMENTAL" in the public header
# are left out of the baseline: they are outside the promise.
set -eu
. "$(dirname "$0")/common.sh"

allow_change=0
if [ "${1:-}" = "--allow-change" ]; then
    allow_change=1
    shift
fi
abi_need_tools abidw abidiff readelf nm
abi_resolve_build "${1:-}"
abi_require_debug_info

suppr=$(mktemp)
out=$(mktemp)
trap 'rm -f "$suppr" "$out" "$out.diff"' EXIT
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

# Only additions may enter the baseline under the same soname.
if [ -f "$BASELINE" ] && [ "$allow_change" -eq 0 ]; then
    old_soname=$(sed -n "1s/.*soname='\([^']*\)'.*/\1/p" "$BASELINE")
    if [ "$old_soname" = "$soname" ]; then
        rc=0
        abidiff --no-added-syms --headers-dir2 "$SRC/include/molq" \
            --drop-private-types --exported-interfaces-only \
            "$BASELINE" "$LIB" >"$out.diff" 2>&1 || rc=$?
        if [ "$rc" -ne 0 ]; then
            cat "$out.diff" >&2
            rm -f "$out.diff"
            abi_die 1 "$LIB removes or changes what $BASELINE promises" \
                "(abidiff exit $rc, report above); baseline not written." \
                "Undo the change, or follow 'Deliberate major-version break' in" \
                "abi/README.md (a new soname), or, for a change shown to be" \
                "compatible, run again with --allow-change."
        fi
        rm -f "$out.diff"
    fi
fi
nfun=$(grep -c "<function-decl .*elf-symbol-id=" "$out" || true)
cp "$out" "$BASELINE"
echo "abi: wrote $BASELINE"
echo "abi: soname $soname, $nfun public functions, from $LIB"
if [ -n "$EXPERIMENTAL_NAMES" ]; then
    echo "abi: left out (experimental):" $EXPERIMENTAL_NAMES
fi
# What abidw cannot record (an enumeration no exported function's signature
# uses is not in the library's exported interface): say so, check.sh
# would keep failing on it.
left=$(abi_coverage "$BASELINE")
if [ -n "$left" ]; then
    echo "abi: WARNING: the new baseline still does not record:" >&2
    printf '%s\n' "$left" | sed 's/^/  /' >&2
    echo "abi: an enumeration is recorded only when an exported function's parameter" \
        "or return type uses it (e.g. a molq_x_name(molq_x) function); a 'mapped'" \
        "name is in lib/molq.map but not exported. abi/check.sh fails until fixed." >&2
fi
echo "abi: review 'git diff abi/libmolq.abi' and commit it with the change that needed it"
