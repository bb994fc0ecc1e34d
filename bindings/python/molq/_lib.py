"""Locating libmolq and declaring the C prototypes (internal module).

Search order for the shared library:

1. the environment variable ``MOLQ_LIBRARY`` (full path to ``libmolq.so``);
   when it is set and cannot be loaded, the import fails rather than
   silently picking up another copy;
2. for an installed copy of the package (``meson install`` puts a generated
   ``_config.py`` beside this file): the library installed with it, by its
   absolute path (``_config.INSTALLED_LIBRARY``), so no environment variable
   is needed; an installed copy does not look for build trees;
   for the package in a source checkout (no ``_config.py``): a build tree of
   that checkout, ``<checkout>/build*/lib/libmolq.so`` where ``<checkout>``
   is two levels above ``bindings/python``, newest first, skipping sanitiser
   builds (a build directory whose name contains ``san``, such as
   ``build-asan``: an instrumented library cannot be loaded into an
   uninstrumented Python);
3. ``ctypes.util.find_library("molq")``, then ``libmolq.so.0`` through the
   dynamic loader's usual search path.
"""

import ctypes
import ctypes.util
import glob
import os

#: Major version of the C library this binding is written for.  The shared
#: library reports major*10000 + minor*100 + patch.
EXPECTED_MAJOR = 0
#: Oldest library release providing every function used here (0.1.0).
MINIMUM_VERSION_NUMBER = 100

_PKG_DIR = os.path.dirname(os.path.abspath(__file__))
# .../bindings/python/molq -> .../bindings/python -> checkout root (../..)
_CHECKOUT = os.path.normpath(os.path.join(_PKG_DIR, os.pardir, os.pardir,
                                          os.pardir))



def _installed_library():
    """The library path recorded at install time, or None (uninstalled)."""
    try:
        from . import _config
    except ImportError:
        return None
    return _config.INSTALLED_LIBRARY


def _candidates(checkout=_CHECKOUT, installed=None):
    """Yield library paths or names to try after MOLQ_LIBRARY, in order.

    `installed` is the library path recorded by an installed copy
    (_installed_library()); with it, the build trees of `checkout` are not
    searched."""
    if installed:
        yield installed
    else:
        for path in sorted(glob.glob(os.path.join(checkout, "build*", "lib",
                                                  "libmolq.so")),
                           key=_mtime, reverse=True):
            build_dir = os.path.basename(os.path.dirname(os.path.dirname(
                path)))
            if "san" not in build_dir:
                yield path
    found = ctypes.util.find_library("molq")
    if found:
        yield found
    yield "libmolq.so.0"


def _mtime(path):
    try:
        return os.path.getmtime(path)
    except OSError:
        return 0.0


def _load():
    env = os.environ.get("MOLQ_LIBRARY")
    if env:
        try:
            return ctypes.CDLL(env)
        except OSError as exc:
            raise ImportError("molq: MOLQ_LIBRARY=%r could not be loaded: %s"
                              % (env, exc)) from exc
    tried = []
    for cand in _candidates(installed=_installed_library()):
        try:
            return ctypes.CDLL(cand)
        except OSError as exc:
            tried.append("%s (%s)" % (cand, exc))
    raise ImportError(
        "molq: the shared library libmolq.so was not found.  Set "
        "MOLQ_LIBRARY to its full path, build the C library (meson setup "
        "build && ninja -C build), or install it.  Tried: " + "; ".join(tried))


lib = _load()

_c = ctypes
_dbl = _c.c_double
_int = _c.c_int
_size = _c.c_size_t
_ptr = _c.c_void_p
_str = _c.c_char_p
_pdbl = _c.POINTER(_c.c_double)

# (name, restype, argtypes) for every function this binding calls.
# Enumerations (molq_status, molq_property, ...) are C ints.
_PROTOTYPES = [
    ("molq_version_number", _c.c_uint, []),
    ("molq_version_string", _str, []),
    ("molq_status_string", _str, [_int]),
    ("molq_property_count", _size, []),
    ("molq_model_count", _size, []),
    ("molq_model_name", _str, [_int]),
    ("molq_property_name", _str, [_int]),
    ("molq_property_unit", _str, [_int]),
    ("molq_property_from_name", _int, [_str, _c.POINTER(_int)]),
    ("molq_spec_new", _int, [_str, _c.POINTER(_ptr)]),
    ("molq_spec_free", None, [_ptr]),
    ("molq_spec_set_formula", _int, [_ptr, _str]),
    ("molq_spec_set_source", _int, [_ptr, _str]),
    ("molq_spec_set_molar_mass", _int, [_ptr, _dbl]),
    ("molq_spec_set_structure", _int, [_ptr, _int]),
    ("molq_spec_set_symmetry_number", _int, [_ptr, _int]),
    ("molq_spec_set_rotational_constants", _int, [_ptr, _pdbl, _size]),
    ("molq_spec_set_rotor", _int, [_ptr, _int]),
    ("molq_spec_add_vibration", _int, [_ptr, _dbl, _int]),
    ("molq_spec_add_electronic_level", _int, [_ptr, _dbl, _int]),
    ("molq_spec_set_formation_enthalpy", _int, [_ptr, _dbl]),
    ("molq_spec_add_geometry_atom", _int, [_ptr, _str, _dbl, _dbl, _dbl]),
    ("molq_spec_set_model", _int, [_ptr, _int]),
    ("molq_spec_add_diatomic_state", _int, [_ptr, _dbl, _int,
                                            _c.POINTER(_size)]),
    ("molq_spec_set_dunham", _int, [_ptr, _size, _c.c_uint, _c.c_uint,
                                    _dbl]),
    ("molq_spec_set_rotational_weights", _int, [_ptr, _size, _dbl, _dbl]),
    ("molq_spec_set_dissociation_energy", _int, [_ptr, _dbl]),
    ("molq_spec_set_spin_isomers_frozen", _int, [_ptr, _dbl]),
    ("molq_spec_set_spin_orbit", _int, [_ptr, _size, _dbl]),
    ("molq_species_create", _int, [_ptr, _c.POINTER(_ptr), _c.c_char_p,
                                   _size]),
    ("molq_species_with_model", _int, [_ptr, _int, _c.POINTER(_ptr),
                                       _c.c_char_p, _size]),
    ("molq_species_model", _int, [_ptr]),
    ("molq_species_free", None, [_ptr]),
    ("molq_species_name", _str, [_ptr]),
    ("molq_species_formula", _str, [_ptr]),
    ("molq_species_source", _str, [_ptr]),
    ("molq_species_molar_mass", _dbl, [_ptr]),
    ("molq_species_has_formation_enthalpy", _int, [_ptr]),
    ("molq_species_t_min", _dbl, [_ptr]),
    ("molq_species_mode_count", _size, [_ptr]),
    ("molq_species_mode_kind", _int, [_ptr, _size, _c.POINTER(_int)]),
    ("molq_mode_kind_name", _str, [_int]),
    ("molq_eval", _int, [_ptr, _dbl, _dbl, _int, _pdbl]),
    ("molq_eval_many", _int, [_ptr, _dbl, _dbl, _c.POINTER(_int), _size,
                              _pdbl]),
    ("molq_eval_batch", _int, [_ptr, _int, _dbl, _pdbl, _size, _pdbl, _size,
                               _size]),
    ("molq_eval_per_mass", _int, [_ptr, _dbl, _dbl, _int, _pdbl]),
    ("molq_eval_mode", _int, [_ptr, _size, _dbl, _dbl, _int, _pdbl]),
    ("molq_eval_spin_conversion", _int, [_ptr, _dbl, _pdbl]),
    ("molq_db_read_file", _int, [_str, _c.POINTER(_ptr), _c.c_char_p, _size]),
    ("molq_db_read_string", _int, [_c.c_char_p, _size, _c.POINTER(_ptr),
                                   _c.c_char_p, _size]),
    ("molq_db_builtin", _int, [_c.POINTER(_ptr), _c.c_char_p, _size]),
    ("molq_db_free", None, [_ptr]),
    ("molq_db_count", _size, [_ptr]),
    ("molq_db_species", _ptr, [_ptr, _size]),
    ("molq_db_find", _int, [_ptr, _str, _c.POINTER(_ptr)]),
    ("molq_db_find_formula", _int, [_ptr, _str, _c.POINTER(_ptr)]),
    ("molq_species_charge", _int, [_ptr]),
    ("molq_species_element_count", _size, [_ptr]),
    ("molq_species_element", _int, [_ptr, _size, _c.POINTER(_c.c_char_p),
                                    _c.POINTER(_c.c_long)]),
    ("molq_species_validated_range", _int, [_ptr, _c.POINTER(_c.c_double),
                                            _c.POINTER(_c.c_double)]),
    ("molq_species_warning_count", _size, [_ptr]),
    ("molq_species_warning", _str, [_ptr, _size]),
    ("molq_db_warning_count", _size, [_ptr]),
    ("molq_db_warning", _str, [_ptr, _size]),
]

for _name, _res, _args in _PROTOTYPES:
    try:
        _fn = getattr(lib, _name)
    except AttributeError as _exc:
        raise ImportError("molq: the loaded library %s lacks %s(); it is too "
                          "old or not libmolq" % (lib._name, _name)) from _exc
    _fn.restype = _res
    _fn.argtypes = _args

LIBRARY_PATH = lib._name
VERSION_NUMBER = lib.molq_version_number()
VERSION_STRING = lib.molq_version_string().decode("ascii", "replace")

def check_version(number, text, path):
    """Raise ImportError unless library version `number` (major*10000 +
    minor*100 + patch, reported as `text` by the library at `path`) has the
    major version this binding is written for and is recent enough."""
    if number // 10000 != EXPECTED_MAJOR:
        raise ImportError(
            "molq: the library %s is version %s (major %d) but this Python "
            "binding is written for major version %d; install a matching "
            "libmolq or point MOLQ_LIBRARY at one"
            % (path, text, number // 10000, EXPECTED_MAJOR))
    if number < MINIMUM_VERSION_NUMBER:
        raise ImportError(
            "molq: the library %s is version %s; this binding needs %d.%d.%d "
            "or newer" % (path, text, MINIMUM_VERSION_NUMBER // 10000,
                          MINIMUM_VERSION_NUMBER // 100 % 100,
                          MINIMUM_VERSION_NUMBER % 100))


check_version(VERSION_NUMBER, VERSION_STRING, LIBRARY_PATH)

#: Size of the caller-owned error buffer allocated for each fallible call.
ERRLEN = 512


def errbuf():
    """A fresh message buffer for one call (never shared between threads)."""
    return ctypes.create_string_buffer(ERRLEN)
