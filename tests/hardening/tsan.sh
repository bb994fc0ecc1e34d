#!/bin/sh
# tests/hardening/tsan.sh -- build molq under ThreadSanitizer and run the
# hardening threading test (tests/hardening/test_threads.c) alone.
#
#   tests/hardening/tsan.sh [BUILD_DIR]      default BUILD_DIR: build-tsan
#
# Environment: CC (compiler for a new build dir; default gcc, clang also
# works), MOLQ_TEST_THREADS and MOLQ_TEST_ROUNDS (passed to the test;
# defaults 16 and 1 here, since TSan runs the code 5-15 times slower).
# Exits non-zero if the build fails, the test fails, or ThreadSanitizer
# reports anything.  No suppressions are used.
set -eu

cd "$(dirname "$0")/../.."
dir=${1:-build-tsan}

if [ ! -f "$dir/build.ninja" ]; then
    CC=${CC:-gcc} meson setup "$dir" -Db_sanitize=thread -Db_lundef=false \
        -Dbuildtype=debugoptimized
fi
ninja -C "$dir" -j2 tests/hardening/test_hardening_threads

log=$dir/meson-logs/tsan-threads.log
# halt_on_error: the first report fails the run; exitcode 66 is TSan's
# own.  second_deadlock_stack helps read lock reports.  Check runs the
# test in-process (CK_FORK=no) so the report reaches this process.
status=0
TSAN_OPTIONS="halt_on_error=1 exitcode=66 second_deadlock_stack=1 ${TSAN_OPTIONS:-}" \
    CK_FORK=no \
    MOLQ_TEST_THREADS=${MOLQ_TEST_THREADS:-16} \
    MOLQ_TEST_ROUNDS=${MOLQ_TEST_ROUNDS:-1} \
    MOLQ_TEST_DATA="$PWD/tests/data" \
    MOLQ_SPECIES_JSON="$dir/lib/builtin_species.json" \
    "$dir/tests/hardening/test_hardening_threads" >"$log" 2>&1 || status=$?
cat "$log"
if grep -q "WARNING: ThreadSanitizer\|ERROR: ThreadSanitizer\|FATAL: ThreadSanitizer" "$log"; then
    echo "tsan.sh: ThreadSanitizer reported a problem (see above)" >&2
    [ "$status" -ne 0 ] || status=66
fi
if [ "$status" -ne 0 ]; then
    echo "tsan.sh: FAILED (exit $status)" >&2
    exit "$status"
fi
echo "tsan.sh: threading test clean under ThreadSanitizer"
