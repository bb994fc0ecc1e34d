#!/bin/sh
# abi/selftest.sh [--rebuild] [BUILD_DIR] -- test that abi/check.sh fails
# when it must.  Works on temporary copies; never touches abi/libmolq.abi
# or BUILD_DIR (default: build, an already-built build directory).
#
# Always (under a second):
#   a1. a function removed from a copy of the baseline: check.sh must fail
#       and name it as not recorded;
#   a2. an enumerator removed from the copy: check.sh must fail naming it;
#   a3. an enumeration renamed in the copy (so the baseline lacks it):
#       check.sh must fail naming it.
#   Control: with the unmodified baseline check.sh names none of these.
# With --rebuild (three -O0 builds of the library alone in a temporary copy of
# the source tree, about 8 s on two cores; meson test 'abi-gate', suite
# abi, passes it):
#   b.  molq_eval_spin_conversion's double T changed to float in the header
#       and the definition: check.sh must fail naming the function;
#   d.  update.sh must refuse to write that library's ABI as the baseline;
#   c1. MOLQ_SPIN_GROUP_TD renumbered (2 -> 3), c2. MOLQ_MODEL_LEVELS
#       renumbered (1 -> 2): check.sh must fail naming the enumerator.
# ABI_SELFTEST_VERBOSE=1 prints check.sh's output for passing cases too.
# Exit 0 all passed, 1 a case failed, 77 skipped (abidiff missing: meson
# reports a skip).
set -u
rebuild=0
if [ "${1:-}" = "--rebuild" ]; then
    rebuild=1
    shift
fi
here=$(cd "$(dirname "$0")" && pwd)
command -v abidiff >/dev/null 2>&1 || { echo "abi-selftest: abidiff not found: skipped"; exit 77; }
build=${1:-$(dirname "$here")/build}
[ -d "$build" ] || { echo "abi-selftest: no build directory $build" >&2; exit 1; }
build=$(cd "$build" && pwd)

tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
failures=0

copy_abi() { # DIR: the scripts and the committed baseline
    mkdir -p "$1"
    cp "$here/check.sh" "$here/common.sh" "$here/update.sh" "$here/libmolq.abi" "$1/"
}

expect() { # NAME WANT_RC PATTERN...  (output of the last run in $tmp/out)
    name=$1 want=$2
    shift 2
    ok=1
    [ "$rc" -eq "$want" ] || ok=0
    for pat in "$@"; do
        grep -F -q -e "$pat" "$tmp/out" || { ok=0; echo "abi-selftest: $name: missing '$pat'"; }
    done
    if [ "$ok" -eq 1 ]; then
        echo "abi-selftest: PASS $name"
        [ -z "${ABI_SELFTEST_VERBOSE:-}" ] || sed 's/^/    /' "$tmp/out"
    else
        failures=$((failures + 1))
        echo "abi-selftest: FAIL $name (check.sh exit $rc, wanted $want); its output:"
        sed 's/^/    /' "$tmp/out"
    fi
}

refute() { # NAME PATTERN...
    name=$1
    shift
    for pat in "$@"; do
        if grep -F -q -e "$pat" "$tmp/out"; then
            failures=$((failures + 1))
            echo "abi-selftest: FAIL $name: unexpected '$pat' in:"
            sed 's/^/    /' "$tmp/out"
            return
        fi
    done
    echo "abi-selftest: PASS $name"
}

run_check() { # ABI_DIR BUILD
    "$1/check.sh" "$2" >"$tmp/out" 2>&1
    rc=$?
}

fn=molq_eval_spin_conversion
en=MOLQ_SPIN_GROUP_TD
enum=molq_spin_group
grep -q "<elf-symbol name='$fn'" "$here/libmolq.abi" &&
    grep -q "<enumerator name='$en'" "$here/libmolq.abi" &&
    grep -q "<enum-decl name='$enum'" "$here/libmolq.abi" || {
    echo "abi-selftest: the committed baseline lacks $fn, $en or $enum" \
        "(run abi/check.sh build)" >&2
    exit 1
}

# Control: the unmodified baseline.
copy_abi "$tmp/control"
run_check "$tmp/control" "$build"
if [ "$rc" -eq 2 ]; then
    sed 's/^/    /' "$tmp/out"
    echo "abi-selftest: check.sh cannot run on $build (above): skipped"
    exit 77
fi
refute "control: unmodified baseline names none of the cases" \
    "function    $fn" "enumerator  $en" "enumeration $enum"

# a1. Function removed: its ELF symbol and its declaration.
copy_abi "$tmp/a1"
awk -v f="$fn" '
    index($0, "<elf-symbol name=\x27" f "\x27") { next }
    index($0, "<function-decl name=\x27" f "\x27") { skip = 1 }
    skip { if (index($0, "</function-decl>")) skip = 0; next }
    { print }
' "$here/libmolq.abi" >"$tmp/a1/libmolq.abi"
run_check "$tmp/a1" "$build"
expect "a1: function missing from the baseline" 1 \
    "abi: FAIL: the baseline abi/libmolq.abi does not record all of the public API" \
    "function    $fn" "abi/update.sh"

# a2. Enumerator removed.
copy_abi "$tmp/a2"
grep -v "<enumerator name='$en'" "$here/libmolq.abi" >"$tmp/a2/libmolq.abi"
run_check "$tmp/a2" "$build"
expect "a2: enumerator missing from the baseline" 1 "enumerator  $en (of $enum)" "abi/update.sh"

# a3. Enumeration missing (renamed in the copy).
copy_abi "$tmp/a3"
sed "s/<enum-decl name='$enum'/<enum-decl name='${enum}_gone'/" "$here/libmolq.abi" >"$tmp/a3/libmolq.abi"
run_check "$tmp/a3" "$build"
expect "a3: enumeration missing from the baseline" 1 "enumeration $enum" "abi/update.sh"

if [ "$rebuild" -eq 1 ]; then
    src=$(dirname "$here")
    mkdir "$tmp/src"
    if git -C "$src" rev-parse --git-dir >/dev/null 2>&1; then
        # The working tree's files, tracked or new (not the ignored builds).
        (cd "$src" && git ls-files -z --cached --others --exclude-standard |
            xargs -0 tar cf - 2>/dev/null) | (cd "$tmp/src" && tar xf -)
    else
        (cd "$src" && tar cf - --exclude='./build*' .) | (cd "$tmp/src" && tar xf -)
    fi
    copy_abi "$tmp/src/abi"
    cp "$tmp/src/include/molq/molq.h" "$tmp/molq.h.orig"
    cp "$tmp/src/lib/api/eval.c" "$tmp/eval.c.orig"
    # -O0 with debug info: the ABI is the same, the build is quicker.
    meson setup "$tmp/build" "$tmp/src" --buildtype=debug >"$tmp/setup.log" 2>&1 ||
        { cat "$tmp/setup.log"; exit 1; }
    lib_target=$(cd "$tmp/build" && ninja -t targets all | sed -n 's|^\(lib/libmolq\.so\.[0-9.]*[0-9]\): .*|\1|p' | head -n 1)

    build_lib() {
        ninja -C "$tmp/build" "$lib_target" >"$tmp/ninja.log" 2>&1 ||
            { cat "$tmp/ninja.log"; echo "abi-selftest: build failed" >&2; exit 1; }
    }

    # b. double -> float in a parameter.
    sed "/molq_eval_spin_conversion(/,/;/ s/double T,/float T,/" "$tmp/molq.h.orig" >"$tmp/src/include/molq/molq.h"
    sed "/^molq_status molq_eval_spin_conversion(/,/)/ s/double T,/float T,/" "$tmp/eval.c.orig" >"$tmp/src/lib/api/eval.c"
    if cmp -s "$tmp/molq.h.orig" "$tmp/src/include/molq/molq.h" || cmp -s "$tmp/eval.c.orig" "$tmp/src/lib/api/eval.c"; then
        echo "abi-selftest: FAIL b: could not apply the edit (declaration moved?)"
        failures=$((failures + 1))
    else
        build_lib
        run_check "$tmp/src/abi" "$tmp/build"
        expect "b: parameter double -> float" 1 \
            "abi: FAIL: $tmp/build/lib/" "function molq_status $fn(const molq_species*, double, double*)" \
            "'double' to 'float'"
    fi

    # d. update.sh must refuse to record that change in the baseline.
    if [ -f "$tmp/build/lib/libmolq.so" ]; then
        "$tmp/src/abi/update.sh" "$tmp/build" >"$tmp/out" 2>&1
        rc=$?
        expect "d: update.sh refuses to record the change" 1 "baseline not written"
        if ! cmp -s "$here/libmolq.abi" "$tmp/src/abi/libmolq.abi"; then
            failures=$((failures + 1))
            echo "abi-selftest: FAIL d: update.sh rewrote the baseline anyway"
        fi
    fi

    # c. Renumbered enumerators.
    cp "$tmp/eval.c.orig" "$tmp/src/lib/api/eval.c"
    renumber() { # CASE ENUMERATOR FROM TO
        sed "s/^\([ \t]*$2[ \t]*=[ \t]*\)$3\b/\1$4/" "$tmp/molq.h.orig" >"$tmp/src/include/molq/molq.h"
        if cmp -s "$tmp/molq.h.orig" "$tmp/src/include/molq/molq.h"; then
            echo "abi-selftest: FAIL $1: could not apply the edit ($2 is no longer = $3?)"
            failures=$((failures + 1))
            return
        fi
        build_lib
        run_check "$tmp/src/abi" "$tmp/build"
        expect "$1: $2 renumbered $3 -> $4" 1 "abi: FAIL: $tmp/build/lib/" "::$2' from value '$3' to '$4'"
    }
    renumber c1 "$en" 2 3
    renumber c2 MOLQ_MODEL_LEVELS 1 2
fi

if [ "$failures" -ne 0 ]; then
    echo "abi-selftest: $failures case(s) failed"
    exit 1
fi
echo "abi-selftest: all cases passed"
