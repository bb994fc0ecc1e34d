#!/bin/sh
# fuzz/regress.sh [TARGET...] -- replay the saved inputs through the fuzz
# targets, without fuzzing: every file in fuzz/regressions/<target>/ (inputs
# that once crashed; they must pass once the bug is fixed) and every seed in
# fuzz/corpus/<target>/.  Each input runs in its own process so all failures
# are listed.  Exit 0 when all pass, 1 when any input crashes or breaks an
# invariant, 2 when clang or its fuzzer runtime is missing.  Installs
# nothing.  Build directory: build-fuzz, or $MOLQ_FUZZ_BUILD.
set -eu

cd "$(dirname "$0")/.."
ROOT=$(pwd)
ALL="species_file cli_numbers spec_api"
TARGETS=${*:-$ALL}
for t in $TARGETS; do
    case " $ALL " in *" $t "*) ;; *) echo "fuzz/regress.sh: unknown target '$t' (targets: $ALL)" >&2; exit 2 ;; esac
done
. fuzz/env.sh

mkdir -p "$B/logs"
log="$B/logs/regress.log"
: >"$log"
passed=0
failed=0
for t in $TARGETS; do
    for kind in regressions corpus; do
        dir="fuzz/$kind/$t"
        [ -d "$dir" ] || continue
        for f in "$dir"/*; do
            [ -f "$f" ] || continue
            case $(basename "$f") in README* | *.md) continue ;; esac
            if "$B/$t" -runs=1 "$f" >"$B/logs/regress-one.log" 2>&1; then
                passed=$((passed + 1))
            else
                failed=$((failed + 1))
                echo "FAIL $t $f" | tee -a "$log" >&2
                { sed -n '/INVARIANT BROKEN/{N;p;q;}' "$B/logs/regress-one.log"
                  grep -m 3 -E 'runtime error|ERROR: (Address|Leak)Sanitizer|SUMMARY: (Address|Leak|Undefined)' \
                      "$B/logs/regress-one.log"; } | sed 's/^/    /' >&2
                cat "$B/logs/regress-one.log" >>"$log"
            fi
        done
    done
done
echo "fuzz/regress.sh: full reports of failures in $log"
echo "$passed passed, $failed failed"
[ "$failed" -eq 0 ]
