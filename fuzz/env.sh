# fuzz/env.sh -- sourced by run.sh and regress.sh (after ROOT is set):
# the build directory, the build, and the sanitiser settings they share.
B=${MOLQ_FUZZ_BUILD:-build-fuzz}
case $B in /*) ;; *) B="$ROOT/$B" ;; esac
export MOLQ_FUZZ_BUILD="$B"

fuzz/build.sh || exit $?

# Symbolised stack traces when llvm-symbolizer is around (Debian llvm-14).
for s in /usr/lib/llvm-14/bin/llvm-symbolizer "$(command -v llvm-symbolizer 2>/dev/null || true)"; do
    if [ -n "$s" ] && [ -x "$s" ]; then
        export ASAN_SYMBOLIZER_PATH="$s"
        break
    fi
done
export ASAN_OPTIONS="${ASAN_OPTIONS:-detect_leaks=1}"
export UBSAN_OPTIONS="${UBSAN_OPTIONS:-halt_on_error=1:print_stacktrace=1}"
