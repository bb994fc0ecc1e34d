#!/bin/sh
# fuzz/run.sh SECONDS [TARGET...] -- build (if needed) and fuzz each target
# for SECONDS seconds.
#
#   fuzz/run.sh 60                      every target, one minute each (CI)
#   fuzz/run.sh 3600 species_file       one target for an hour
#
# Targets: species_file cli_numbers spec_api (default: all, one after the
# other).  Starts from the committed seeds in fuzz/corpus/<target>/ plus the
# inputs found by earlier runs in <build>/corpus/<target>/ (scratch, never
# committed; delete it to start afresh).  A crash, invariant failure, leak,
# timeout (> 25 s for one input) or memory blow-up (> 2 GiB) is written to
# fuzz/crashes/<target>-crash-<sha1> (or leak-, timeout-, oom-) and makes
# the script exit 1 after the remaining targets have run.  Exit 2: clang or
# its fuzzer runtime is missing (fuzz/build.sh names the packages).
# Installs nothing.  Build directory: build-fuzz, or $MOLQ_FUZZ_BUILD.
# Extra libFuzzer flags: $FUZZ_FLAGS (e.g. "-fork=2 -ignore_crashes=1" to
# keep going after a crash and collect several).
set -eu

cd "$(dirname "$0")/.."
ROOT=$(pwd)
ALL="species_file cli_numbers spec_api"

usage() {
    echo "usage: fuzz/run.sh SECONDS [TARGET...]   (targets: $ALL)" >&2
    exit 2
}
[ $# -ge 1 ] || usage
SECS=$1
shift
case $SECS in '' | *[!0-9]*) usage ;; esac
[ "$SECS" -ge 1 ] || usage
TARGETS=${*:-$ALL}
for t in $TARGETS; do
    case " $ALL " in *" $t "*) ;; *) echo "fuzz/run.sh: unknown target '$t'" >&2; usage ;; esac
done

. fuzz/env.sh

mkdir -p fuzz/crashes "$B/logs"
failed=""
for t in $TARGETS; do
    case $t in
    species_file) maxlen=8192 ;;  # the largest seed is ~4.4 kB
    cli_numbers) maxlen=512 ;;    # list entries and range parts stop at 127 bytes
    spec_api) maxlen=4096 ;;      # runs of 1000+ modes are encoded in 12 bytes
    esac
    dict=""
    [ -f "fuzz/$t.dict" ] && dict="-dict=fuzz/$t.dict"
    mkdir -p "$B/corpus/$t"
    log="$B/logs/$t.log"
    echo "fuzz/run.sh: $t for ${SECS}s (log: $log)"
    set +e
    "$B/$t" -max_total_time="$SECS" -max_len=$maxlen -timeout=25 \
        -rss_limit_mb=2048 -use_value_profile=1 -print_final_stats=1 \
        $dict ${FUZZ_FLAGS:-} -artifact_prefix="fuzz/crashes/$t-" \
        "$B/corpus/$t" "fuzz/corpus/$t" >"$log" 2>&1
    rc=$?
    set -e
    if [ $rc -eq 0 ]; then
        grep -E '^stat::number_of_executed_units|^stat::peak_rss_mb' "$log" |
            sed "s/^/  /"
        grep -E '#[0-9]+ +DONE' "$log" | tail -n 1 | sed "s/^/  /"
    else
        failed="$failed $t"
        echo "fuzz/run.sh: $t FAILED (exit $rc); the report:" >&2
        # The invariant message or sanitizer report, then the stack.
        sed -n '/INVARIANT BROKEN\|ERROR: AddressSanitizer\|runtime error\|ERROR: LeakSanitizer\|ERROR: libFuzzer\|==ERROR/,$p' "$log" |
            head -n 60 >&2
        grep -E 'Test unit written to' "$log" >&2 || true
    fi
done

if [ -n "$failed" ]; then
    echo "fuzz/run.sh: failing targets:$failed (inputs in fuzz/crashes/;" \
        "minimise with: $B/<target> -minimize_crash=1 -runs=10000 fuzz/crashes/<file>)" >&2
    exit 1
fi
echo "fuzz/run.sh: no crash in $TARGETS"
