#!/bin/sh
# abi/check.sh [BUILD_DIR] -- check the shared library in an already-built
# build directory (default: build) against the committed ABI baseline
# abi/libmolq.abi.  Builds nothing.
#
# Passes (exit 0) when the library has the baseline's soname and its ABI is
# the baseline's or the baseline's plus additions (new functions, enum
# values appended).  Fails (exit 1) and prints abidiff's report when
# anything in the baseline was removed or changed -- including changes
# abidiff itself only flags as "possibly incompatible" (a parameter or
# return type, an enumerator's value): under molq's ABI policy every such
# change needs a new soname.  Exit 2: the check could not run (abidiff
# missing, no library, no debug info, abidiff error).
#
# See abi/README.md for the policy and for what to do when it fails.
set -u
. "$(dirname "$0")/common.sh"

abi_need_tools abidiff readelf
abi_resolve_build "${1:-}"
[ -f "$BASELINE" ] || abi_die 2 "no baseline at $BASELINE (create it with abi/update.sh)"
abi_require_debug_info

base_soname=$(sed -n "1s/.*soname='\([^']*\)'.*/\1/p" "$BASELINE")
lib_soname=$(abi_soname "$LIB")
if [ "$base_soname" != "$lib_soname" ]; then
    echo "abi: FAIL: soname of $LIB is '$lib_soname', the baseline records '$base_soname'." >&2
    echo "abi: A soname change is a deliberate major-version break: follow" \
        "'Deliberate major-version break' in abi/README.md (which ends with" \
        "abi/update.sh); otherwise restore molq_soversion in meson.build." >&2
    exit 1
fi

report=$(mktemp)
trap 'rm -f "$report" "$report.x"' EXIT
# abidiff exit status is a bit set: 1 error, 2 usage error, 4 ABI change,
# 8 incompatible ABI change.  Additions alone set bit 4 too, and so do type
# changes abidiff cannot prove incompatible (size_t -> int in a parameter,
# a renumbered enumerator), so bit 4 alone cannot tell "only additions" from
# a break.  Running with --no-added-syms filters the additions out first:
# whatever is left is a change to something the baseline promised.
set -- --headers-dir2 "$SRC/include/molq" --drop-private-types \
    --exported-interfaces-only --fail-no-debug-info "$BASELINE" "$LIB"

abidiff --no-added-syms "$@" >"$report" 2>&1
rc=$?
if [ $((rc & 3)) -ne 0 ]; then
    cat "$report" >&2
    abi_die 2 "abidiff failed (exit $rc) comparing $BASELINE with $LIB"
fi

if [ "$rc" -ne 0 ]; then
    if [ $((rc & 8)) -ne 0 ]; then
        what="an incompatible ABI change (abidiff: ABIDIFF_ABI_INCOMPATIBLE_CHANGE)"
    else
        what="a change to the existing ABI (abidiff: ABIDIFF_ABI_CHANGE; molq's policy allows only additions)"
    fi
    echo "abi: FAIL: $LIB ($lib_soname) has $what against abi/libmolq.abi:"
    echo
    abidiff "$@"
    echo
    echo "abi: Within $lib_soname no function may be removed or moved to another"
    echo "abi: symbol node, and no parameter, return type or enumerator value may"
    echo "abi: change. Undo the change, or see abi/README.md for the deliberate"
    echo "abi: major-version break."
    exit 1
fi

abidiff "$@" >"$report" 2>&1
full=$?
if [ $((full & 4)) -ne 0 ]; then
    abi_experimental_suppr "$report.x"
    rm -f "$report.x"
    echo "abi: compatible additions since the baseline:"
    grep -e '^  \[A\]' "$report" | sed 's/^  //' |
        awk -v x=" $EXPERIMENTAL_NAMES " '{
            n = $0; sub(/.*[{]/, "", n); sub(/@.*/, "", n)
            print $0 (index(x, " " n " ") ? "  (experimental: not promised)" : "")
        }'
fi
# Additions into a symbol node the baseline already has: harmless before the
# first release of that node, but once it has shipped new functions belong in
# a new node, so that a program needing them fails at load time with a clear
# version error against an older libmolq instead of at its first call.
nodes=$(sed -n "s/.*<elf-symbol .* version='\([^']*\)'.*/\1/p" "$BASELINE" | sort -u)
for node in $nodes; do
    re=$(printf '%s' "$node" | sed 's/\./\\./g')
    n=$(grep -c -e "^  \[A\] .*@@$re}\$" -e "^  \[A\] [a-z_0-9]*@@$re\$" "$report" || true)
    [ "$n" -gt 0 ] && echo "abi: note: $n addition(s) in node $node, which the baseline already" \
        "has: fine until $node ships; after a release add a new node (see abi/README.md)"
done
echo "abi: OK: $LIB ($lib_soname) is compatible with abi/libmolq.abi"
exit 0
