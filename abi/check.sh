#!/bin/sh
# abi/check.sh [BUILD_DIR] -- check the shared library in an already-built
# build directory (default: build) against the committed ABI baseline
# abi/libmolq.abi.  Builds nothing.
#
# Passes (exit 0) when the library has the baseline's soname, its ABI is
# exactly the baseline's, and the baseline records the whole public API.
# Fails (exit 1) when
#   - anything in the baseline was removed or changed -- including changes
#     abidiff itself only flags as "possibly incompatible" (a parameter or
#     return type, an enumerator's value): under molq's ABI policy every
#     such change needs a new soname; abidiff's report is printed;
#   - the public API has something the baseline does not record: an
#     exported function (the library's dynamic symbol table, lib/molq.map),
#     an enumeration of include/molq/molq.h or one of its enumerators
#     (the MOLQ_EXPERIMENTAL section excepted).  Nothing would notice such
#     an addition change later, so an addition goes under the check in the
#     commit that adds it: abi/update.sh, then commit abi/libmolq.abi.
# Exit 2: the check could not run (abidiff missing, no library, no debug
# info, abidiff error).
#
# See abi/README.md for the policy and for what to do when it fails.
set -u
. "$(dirname "$0")/common.sh"

abi_need_tools abidiff readelf nm
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
missing=$(mktemp)
trap 'rm -f "$report" "$report.x" "$missing"' EXIT
failed=0

# 1. Does the baseline promise the whole public API?  What it does not
#    record, abidiff cannot see change.
abi_coverage "$BASELINE" >"$missing"
if [ -s "$missing" ]; then
    failed=1
    echo "abi: FAIL: the baseline abi/libmolq.abi does not record all of the public API"
    echo "abi: of $LIB, so a later change to these would pass unnoticed:"
    sed -n 's/^function /  function    /p' "$missing"
    sed -n 's/^enum /  enumeration /p' "$missing"
    sed -n 's/^enumerator \([^ ]*\) \(.*\)/  enumerator  \2 (of \1)/p' "$missing"
    if grep -q '^mapped ' "$missing"; then
        echo "abi: listed in lib/molq.map but not exported by the library (fix the map or"
        echo "abi: the definition; tests/check_exports.py says more):"
        sed -n 's/^mapped /  /p' "$missing"
    fi
    if grep -q '^untagged ' "$missing"; then
        echo "abi: enumerations without a tag (write 'typedef enum molq_x { ... } molq_x;'"
        echo "abi: so the baseline can name them):"
        sed -n 's/^untagged /  /p' "$missing" | cut -c1-100
    fi
    echo "abi: An addition to the API goes under the check in the same commit that adds it:"
    echo "abi:   ninja -C ${1:-build} && abi/update.sh ${1:-build} && git diff abi/libmolq.abi"
    echo "abi: then commit abi/libmolq.abi together with the addition. When merging branches"
    echo "abi: that each add to the API, run abi/update.sh on the merged result."
    echo "abi: update.sh refuses to record a change to what the baseline already promises."
    echo
fi

# 2. Is everything the baseline promises unchanged?
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
    failed=1
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
fi
[ "$failed" -eq 0 ] || exit 1

# Additions abidiff sees but the coverage check let through can only be
# experimental functions: list them.
abidiff "$@" >"$report" 2>&1
full=$?
if [ $((full & 4)) -ne 0 ] && grep -q -e '^  \[A\]' "$report"; then
    abi_experimental_suppr "$report.x"
    rm -f "$report.x"
    echo "abi: additions since the baseline:"
    grep -e '^  \[A\]' "$report" | sed 's/^  //' |
        awk -v x=" $EXPERIMENTAL_NAMES " '{
            n = $0; sub(/.*[{]/, "", n); sub(/@.*/, "", n)
            print $0 (index(x, " " n " ") ? "  (experimental: not promised)" : "")
        }'
fi
echo "abi: OK: $LIB ($lib_soname) matches abi/libmolq.abi, which records all of its public API"
exit 0
