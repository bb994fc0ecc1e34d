#!/bin/sh
# tests/install/install_check.sh SRCDIR [WORKDIR]
#
# Installs molq into a fresh prefix and uses it as a user would, with no
# environment variables that point at it: the installed `molq` tool, a C
# program compiled and linked through pkg-config, and the installed Python
# package (found through a .pth file, the route README.md gives, and through
# sys.path).  Every run goes through `env -i PATH=/usr/bin:/bin`, so no
# LD_LIBRARY_PATH, PYTHONPATH or MOLQ_LIBRARY reaches it.
#
# `meson install --destdir` would not do: the rpaths and the recorded library
# path name the final prefix, so the prefix must be the real one.  The copy
# is configured from SRCDIR with --prefix=<tmp>/prefix and only the installed
# targets are built (library, tool), at -O0, to keep it short.
#
# MESON and NINJA name the programs to build the copy with (default: meson
# and ninja on PATH).  Exit 0 passed, 1 failed, 77 skipped (no cc,
# pkg-config or /usr/bin/python3).
set -eu
MESON=${MESON:-$(command -v meson)}
NINJA=${NINJA:-$(command -v ninja)}

src=${1:?usage: install_check.sh SRCDIR [WORKDIR]}
src=$(cd "$src" && pwd)
if [ $# -ge 2 ]; then
    tmp=$2
    rm -rf "$tmp"
    mkdir -p "$tmp"
else
    tmp=$(mktemp -d "${TMPDIR:-/tmp}/molq-install.XXXXXX")
    trap 'rm -rf "$tmp"' EXIT
fi
prefix=$tmp/prefix
build=$tmp/build
clean="env -i PATH=/usr/bin:/bin HOME=$tmp"

for prog in cc pkg-config /usr/bin/python3; do
    command -v "$prog" >/dev/null 2>&1 || { echo "install-check: no $prog, skipped"; exit 77; }
done

fail() { echo "install-check: FAIL: $*" >&2; exit 1; }

# Configure and build outside the caller's environment as well, so a
# PKG_CONFIG_PATH or compiler flags of the caller do not leak in.
$clean "$MESON" setup "$build" "$src" --prefix="$prefix" --buildtype=plain \
    >"$tmp/setup.log" 2>&1 || { cat "$tmp/setup.log"; fail "meson setup"; }
lib_target=$(cd "$build" && "$NINJA" -t targets all |
    sed -n 's|^\(lib/libmolq\.so\.[0-9.]*[0-9]\): .*|\1|p' | head -n 1)
[ -n "$lib_target" ] || fail "no shared library target"
$clean "$NINJA" -C "$build" "$lib_target" lib/libmolq.a tools/molq \
    >"$tmp/ninja.log" 2>&1 || { cat "$tmp/ninja.log"; fail "build"; }
$clean "$MESON" install -C "$build" --no-rebuild --quiet \
    >"$tmp/install.log" 2>&1 || { cat "$tmp/install.log"; fail "meson install"; }

pc=$(find "$prefix" -name molq.pc | head -n 1)
[ -n "$pc" ] || fail "molq.pc not installed under $prefix"
pcdir=$(dirname "$pc")
libdir=$($clean PKG_CONFIG_PATH="$pcdir" pkg-config --variable=libdir molq)
echo "install-check: prefix $prefix, libdir $libdir"
[ -f "$libdir/libmolq.so.0" ] || fail "$libdir/libmolq.so.0 not installed"

# 1. The installed tool.
out=$($clean "$prefix/bin/molq" table N2 --T 1000 --format csv 2>&1) ||
    fail "installed molq: $out"
echo "$out" | grep -q '^N2,1000,' || fail "installed molq printed: $out"
echo "install-check: molq tool ok"

# 2. A C program linked through pkg-config (the README's command).
cat >"$tmp/prog.c" <<'CEOF'
#include <stdio.h>
#include <molq/molq.h>
int main(void)
{
    char err[256];
    molq_db *db;
    const molq_species *n2;
    double cp;
    if (molq_db_builtin(&db, err, sizeof err) != MOLQ_OK) { puts(err); return 1; }
    if (molq_db_find(db, "N2", &n2) != MOLQ_OK) return 1;
    if (molq_eval(n2, 1000.0, MOLQ_P_STANDARD, MOLQ_CP, &cp) != MOLQ_OK) return 1;
    printf("cp %.3f\n", cp);
    molq_db_free(db);
    return 0;
}
CEOF
flags=$($clean PKG_CONFIG_PATH="$pcdir" pkg-config --cflags --libs molq) ||
    fail "pkg-config --cflags --libs molq"
# shellcheck disable=SC2086
$clean cc -o "$tmp/prog" "$tmp/prog.c" $flags >"$tmp/cc.log" 2>&1 ||
    { cat "$tmp/cc.log"; fail "cc prog.c \$(pkg-config --cflags --libs molq) [$flags]"; }
out=$($clean "$tmp/prog" 2>&1) || fail "pkg-config-linked program: $out"
echo "$out" | grep -q '^cp ' || fail "pkg-config-linked program printed: $out"
echo "install-check: pkg-config-linked program ok ($flags)"

# 3. The installed Python package, under the system python3 (not the one
# meson found), first through a .pth file in a site directory ...
pydir=$prefix/share/molq/python    # the default python_dir, <datadir>/molq/python
[ -f "$pydir/molq/__init__.py" ] || fail "Python package not installed in $pydir"
site=$tmp/site
mkdir -p "$site"
echo "$pydir" >"$site/molq.pth"
code='import molq, sys
db = molq.Database.builtin()
cp = db["N2"].cp(1000.0)
assert 30.0 < cp < 35.0, cp
print("ok", molq.library_path())'
out=$($clean /usr/bin/python3 -c "import site; site.addsitedir('$site')
$code" 2>&1) || fail "python3 with molq.pth: $out"
case $out in
ok\ "$libdir"/*) ;;
*) fail "python3 with molq.pth loaded: $out (want $libdir)" ;;
esac
# ... then through sys.path, from another working directory.
out=$(cd / && $clean /usr/bin/python3 -c "import sys; sys.path.insert(0, '$pydir')
$code" 2>&1) || fail "python3 with sys.path: $out"
echo "install-check: Python package ok ($out)"
echo "install-check: passed"
