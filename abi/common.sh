# abi/common.sh -- shared by abi/check.sh and abi/update.sh (sourced, not run).
#
# Sets: ABI_DIR, ROOT, BASELINE, and provides
#   abi_need_tools TOOL...      exit 2 with an install hint if a tool is missing
#   abi_resolve_build DIR       sets BUILD, SRC (source tree of that build), LIB
#   abi_require_debug_info      exit 2 unless LIB carries DWARF
#   abi_soname FILE             print the DT_SONAME of an ELF file
#   abi_experimental_suppr OUT  write an abigail suppression file naming the
#                               functions declared after #ifdef MOLQ_EXPERIMENTAL
#                               in $SRC/include/molq/molq.h
#   abi_coverage BASELINE_FILE  print what the public API has and the baseline
#                               does not record (see the function)

ABI_DIR=$(cd "$(dirname "$0")" && pwd)
ROOT=$(dirname "$ABI_DIR")
BASELINE="$ABI_DIR/libmolq.abi"
# sort and comm must agree on the order.
LC_ALL=C
export LC_ALL

abi_die() { # code message...
    code=$1
    shift
    echo "abi: $*" >&2
    exit "$code"
}

abi_need_tools() {
    for t in "$@"; do
        if ! command -v "$t" >/dev/null 2>&1; then
            case $t in
            abidw | abidiff) pkg=abigail-tools ;;
            readelf) pkg=binutils ;;
            *) pkg=$t ;;
            esac
            abi_die 2 "'$t' not found. Install it with: apt-get install $pkg" \
                "(tools/dev.sh setup installs it once '$pkg' is in its PACKAGES list)"
        fi
    done
}

abi_resolve_build() {
    BUILD=${1:-$ROOT/build}
    [ -d "$BUILD" ] || abi_die 2 "build directory '$BUILD' does not exist" \
        "(configure and build it first: meson setup $BUILD && ninja -C $BUILD)"
    BUILD=$(cd "$BUILD" && pwd)
    # The source tree this build was configured from (its public headers are
    # the ones that describe the library in it).
    SRC=""
    info="$BUILD/meson-info/meson-info.json"
    if [ -f "$info" ]; then
        SRC=$(sed -n 's/.*"source": *"\([^"]*\)".*/\1/p' "$info" | head -n 1)
    fi
    [ -n "$SRC" ] && [ -f "$SRC/include/molq/molq.h" ] || SRC=$ROOT
    # libmolq.so is the development link meson points at the current
    # libmolq.so.MAJOR.MINOR.PATCH; older versions may linger beside it.
    LIB=""
    if [ -e "$BUILD/lib/libmolq.so" ]; then
        LIB=$(readlink -f "$BUILD/lib/libmolq.so")
    else
        for f in "$BUILD"/lib/libmolq.so.*.*; do
            [ -f "$f" ] && [ ! -L "$f" ] && LIB=$f
        done
    fi
    [ -n "$LIB" ] && [ -f "$LIB" ] || abi_die 2 "no shared library in $BUILD/lib" \
        "(build it first: ninja -C $BUILD)"
}

abi_require_debug_info() {
    readelf -S --wide "$LIB" | grep -q '\.debug_info' ||
        abi_die 2 "$LIB has no debug info, so the types of the API cannot be" \
            "compared. Use a build with -g (buildtype debugoptimized, the default" \
            "here, or debug)."
}

abi_soname() {
    readelf -d --wide "$1" | sed -n 's/.*(SONAME).*\[\(.*\)\].*/\1/p'
}

abi_experimental_suppr() { # OUT
    # Names of functions declared between "#ifdef MOLQ_EXPERIMENTAL" and its
    # matching #endif; nested #if/#endif pairs are counted.
    names=$(awk '
        /^[ \t]*#[ \t]*if(def)?[ \t]+(defined[ \t]*\(?[ \t]*)?MOLQ_EXPERIMENTAL([^A-Za-z0-9_]|$)/ {
            if (!depth) { depth = 1; next }
        }
        depth && /^[ \t]*#[ \t]*if/ { depth++ }
        depth && /^[ \t]*#[ \t]*endif/ { depth--; next }
        depth { print }
    ' "$SRC/include/molq/molq.h" | tr '\n' ' ' |
        grep -o 'MOLQ_API[^;(]*\bmolq_[A-Za-z0-9_]*[ \t]*(' |
        sed 's/.*\(molq_[A-Za-z0-9_]*\)[ \t]*(/\1/' | sort -u)
    : >"$1"
    for n in $names; do
        printf '[suppress_function]\n  symbol_name = %s\n  drop = yes\n\n' "$n" >>"$1"
    done
    EXPERIMENTAL_NAMES=$names
}

abi_public_header() {
    # The public header without its MOLQ_EXPERIMENTAL section and without
    # comments, as one line.  The header is C89 (tests/header_compile.c
    # builds it with -std=c89 -pedantic), so comments are /* ... */ only.
    awk '
        /^[ \t]*#[ \t]*if(def)?[ \t]+(defined[ \t]*\(?[ \t]*)?MOLQ_EXPERIMENTAL([^A-Za-z0-9_]|$)/ {
            if (!depth) { depth = 1; next }
        }
        depth && /^[ \t]*#[ \t]*if/ { depth++ }
        depth && /^[ \t]*#[ \t]*endif/ { depth--; next }
        !depth { print }
    ' "$SRC/include/molq/molq.h" | tr '\n\t' '  ' |
        sed 's|/\*[^*]*\*\**\([^/*][^*]*\*\**\)*/| |g'
}

abi_coverage() { # BASELINE_FILE
    # Lists, one per line, what the library or its public header offers that
    # BASELINE_FILE does not record, so that abidiff could not see it change:
    #   function NAME        exported by $LIB (dynamic symbol table)
    #   mapped NAME          listed in lib/molq.map but not exported by $LIB
    #   enum NAME            an enumeration of the public header
    #   enumerator ENUM NAME an enumerator of a recorded enumeration
    #   untagged TEXT        an enumeration without a tag (cannot be matched)
    # Functions declared after #ifdef MOLQ_EXPERIMENTAL are left out, like
    # enumerations declared there.  Sets EXPERIMENTAL_NAMES.
    _cov_base=$1
    _cov_tmp=$(mktemp -d)
    abi_experimental_suppr "$_cov_tmp/suppr"
    printf '%s\n' $EXPERIMENTAL_NAMES | sort -u >"$_cov_tmp/experimental"
    # Recorded in the baseline: ELF symbols, enumerations, enumerators.
    sed -n "s/.*<elf-symbol name='\([^']*\)'.*/\1/p" "$_cov_base" |
        sort -u >"$_cov_tmp/base_syms"
    awk "
        /<enum-decl name='/ { cur = \$0; sub(/.*<enum-decl name='/, \"\", cur)
                              sub(/'.*/, \"\", cur); print cur; next }
        /<\\/enum-decl>/ { cur = \"\"; next }
        cur != \"\" && /<enumerator name='/ { e = \$0
                              sub(/.*<enumerator name='/, \"\", e); sub(/'.*/, \"\", e)
                              print cur \" \" e }
    " "$_cov_base" | sort -u >"$_cov_tmp/base_enums"
    # Exported by the library (defined global symbols, version suffix cut).
    nm -D --defined-only "$LIB" |
        awk '$2 ~ /^[TDBRWiV]$/ { n = $3; sub(/@.*/, "", n); print n }' |
        sort -u >"$_cov_tmp/lib_syms"
    # Listed in the version script of the source tree.
    : >"$_cov_tmp/map_syms"
    if [ -f "$SRC/lib/molq.map" ]; then
        tr '\n\t' '  ' <"$SRC/lib/molq.map" |
            sed 's|/\*[^*]*\*\**\([^/*][^*]*\*\**\)*/| |g' | tr ';{}' '\n\n\n' |
            sed -n 's/^[ \t]*\(global:[ \t]*\)\{0,1\}\(molq_[A-Za-z0-9_]*\)[ \t]*$/\2/p' |
            sort -u >"$_cov_tmp/map_syms"
    fi
    comm -23 "$_cov_tmp/lib_syms" "$_cov_tmp/base_syms" |
        comm -23 - "$_cov_tmp/experimental" | sed 's/^/function /'
    comm -23 "$_cov_tmp/map_syms" "$_cov_tmp/lib_syms" |
        comm -23 - "$_cov_tmp/experimental" | sed 's/^/mapped /'
    # Enumerations of the public header: "enum TAG { A = 1, B, ... }".
    abi_public_header >"$_cov_tmp/header"
    grep -o 'enum *{[^}]*}' "$_cov_tmp/header" | sed 's/^/untagged /'
    grep -o 'enum *[A-Za-z_][A-Za-z0-9_]* *{[^}]*}' "$_cov_tmp/header" |
        sed 's/^enum *\([A-Za-z0-9_]*\) *{\([^}]*\)}/\1 \2/' |
        while read -r tag body; do
            if ! grep -qx "$tag" "$_cov_tmp/base_enums"; then
                echo "enum $tag"
                continue
            fi
            printf '%s\n' "$body" | tr ',' '\n' |
                sed -n 's/^ *\([A-Za-z_][A-Za-z0-9_]*\).*/\1/p' |
                while read -r e; do
                    grep -qx "$tag $e" "$_cov_tmp/base_enums" || echo "enumerator $tag $e"
                done
        done
    rm -rf "$_cov_tmp"
}
