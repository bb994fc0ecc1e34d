"""Pythonic classes over the molq C API (internal module; import ``molq``).

Units everywhere: T in K, p in Pa, energies in J/mol, entropies and heat
capacities in J/(mol K), their T-derivatives in J/(mol K^2); molar mass in
g/mol on the Python side (kg/mol in the C library); spectroscopic inputs
(rotational constants, vibrational wavenumbers, electronic level energies)
in cm^-1.
"""

import array
import collections.abc
import ctypes
import difflib
import json
import math
import numbers
import operator
import os
import sys
import threading
import weakref

from . import _lib

_L = _lib.lib

#: Standard-state pressure of the published tables, Pa.
P_STANDARD = 1.0e5
#: Reference temperature of the enthalpy scale, K.
T_REF = 298.15

# Symbolic names of molq_status values (molq.h).  Values never change.
STATUS_NAMES = {
    0: "MOLQ_OK",
    1: "MOLQ_EARG",
    2: "MOLQ_ENOMEM",
    3: "MOLQ_EIO",
    4: "MOLQ_ESYNTAX",
    5: "MOLQ_EKEY",
    6: "MOLQ_ETYPE",
    7: "MOLQ_EVALUE",
    8: "MOLQ_EDUPLICATE",
    9: "MOLQ_ENOTFOUND",
    10: "MOLQ_EDOMAIN",
    11: "MOLQ_ERANGE",
    12: "MOLQ_ELIMIT",
}
# Status codes as module constants: molq.EDOMAIN == 10, ...
(OK, EARG, ENOMEM, EIO, ESYNTAX, EKEY, ETYPE, EVALUE, EDUPLICATE, ENOTFOUND,
 EDOMAIN, ERANGE, ELIMIT) = range(13)

_MOLQ_LNQ, _MOLQ_U, _MOLQ_CV, _MOLQ_S = 0, 4, 2, 5

_STRUCTURES = {"atom": 0, "linear": 1, "nonlinear": 2}
_ROTORS = {"corrected": 0, "classical": 1}
_INT_CLAMP = 1000000000

# The library's models (molq_model) by the names species files use.  A new
# model needs one entry here and nothing else in the binding.
def _name_table(count, name_of):
    """{name: value} of a library enumeration, read from the library so a
    new value needs no change here."""
    table = {}
    for i in range(count()):
        name = name_of(i)
        if name is not None:
            table[name.decode("ascii")] = i
    return table


# "rrho" (rigid rotor, harmonic vibrations, electronic levels), "levels"
_MODELS = _name_table(_L.molq_model_count, _L.molq_model_name)
_MODEL_BY_ID = {v: k for k, v in _MODELS.items()}

# Named spectroscopic constants of a diatomic state as Dunham coefficients
# Y_kl: name -> (k, l, sign), as in molq.h (molq_spec_set_dunham) and the
# species-file reader.
_NAMED_CONSTANTS = {
    "we": (1, 0, 1.0), "wexe": (2, 0, -1.0), "weye": (3, 0, 1.0),
    "weze": (4, 0, 1.0), "Be": (0, 1, 1.0), "alpha_e": (1, 1, -1.0),
    "gamma_e": (2, 1, 1.0), "De": (0, 2, -1.0), "beta_e": (1, 2, -1.0),
    "He": (0, 3, 1.0),
}
_STATE_KEYS = ("label", "Te", "degeneracy", "rotational_weights",
               "dunham", "spin_orbit", "re") + tuple(_NAMED_CONSTANTS)
_DUNHAM_ROWS, _DUNHAM_COLS = 6, 4  # powers of (v + 1/2), of J(J+1)


class MolqError(Exception):
    """An error reported by the molq C library.

    Attributes:
        status (int): the library's status code (see ``molq.STATUS_NAMES``;
            e.g. ``molq.EVALUE == 7``, ``molq.EDOMAIN == 10``).
        status_name (str): its symbolic name, e.g. ``"MOLQ_EVALUE"``.
        description (str): the library's description of the status code.
        message (str): the library's message, naming the species and field
            where it can ("species 'X': field 'symmetry_number': ...").
    """

    def __init__(self, status, message):
        self.status = int(status)
        self.status_name = STATUS_NAMES.get(self.status,
                                            "MOLQ_STATUS_%d" % self.status)
        self.description = status_string(self.status)
        self.message = message
        super().__init__(message)

    def __str__(self):
        return "%s [%s]" % (self.message, self.status_name)

    def __reduce__(self):
        return (type(self), (self.status, self.message))


def status_string(status):
    """The library's English description of a status code."""
    text = _L.molq_status_string(int(status))
    return text.decode("utf-8", "replace") if text else "unknown status"


def _decode(raw):
    return raw.decode("utf-8", "replace") if raw is not None else ""


def _fail(status, buf, fallback):
    """Raise MolqError for a non-zero status; message from the caller-owned
    buffer when the library filled it, else from `fallback`."""
    msg = buf.value.decode("utf-8", "replace") if buf is not None else ""
    if not msg:
        msg = "%s: %s" % (fallback, status_string(status))
    raise MolqError(status, msg)


def _encode_name(text, what):
    """A lookup key as the C string the library compares, or None when no
    name or formula can equal it: a key holding a NUL (ctypes would pass
    only the text before it, so "C\\0O2" would find "C") or a str that is
    not encodable as UTF-8 (a lone surrogate; names are UTF-8)."""
    if isinstance(text, bytes):
        raw = text
    elif not isinstance(text, str):
        raise TypeError("%s must be a str, not %s" % (what,
                                                      type(text).__name__))
    else:
        try:
            raw = text.encode("utf-8")
        except UnicodeEncodeError:
            return None
    return None if b"\0" in raw else raw


# ---------------------------------------------------------------------------
# Properties
# ---------------------------------------------------------------------------

_PROPS = _name_table(_L.molq_property_count, _L.molq_property_name)


# Properties molq_eval_per_mass returns unchanged (molq.h): ln q and
# d(g/RT)/dT are not per-mole quantities.
_UNSCALED = frozenset(_PROPS[n] for n in ("lnq", "dgRT_dT") if n in _PROPS)


def property_names():
    """Names of the properties this library computes, in the library's order
    ("lnq", "cp", "cv", "h", ..., "h_minus_h298", "gef", ...)."""
    return list(_PROPS)


def property_unit(name):
    """SI unit of a property per mole, e.g. ``"J/(mol K)"`` for ``"cp"``
    (``"1"`` for dimensionless).  Unknown names raise ValueError."""
    return _decode(_L.molq_property_unit(_prop_id(name)))


def _lookup(table, name, what, plural):
    """Value of `name` in a name table; ValueError naming the known ones."""
    try:
        return table[name]
    except (KeyError, TypeError):
        pass
    raise ValueError("unknown %s %r; known %s: %s"
                     % (what, name, plural, ", ".join(table)))


def _prop_id(name):
    return _lookup(_PROPS, name, "property", "properties")


def model_names():
    """Names of the models this binding knows, in the library's order
    (``["rrho", "levels"]``): ``"rrho"`` rigid rotor, harmonic vibrations
    and an electronic level list; ``"levels"`` explicit level sums: the
    bound ro-vibrational levels of each electronic state of a diatomic,
    hindered internal rotors of a polyatomic."""
    return list(_MODELS)


def _model_id(name):
    return _lookup(_MODELS, name, "model", "models")


def version():
    """Version string of the loaded C library, e.g. ``"0.1.0"``."""
    return _lib.VERSION_STRING


def library_path():
    """File name the C library was loaded from."""
    return _lib.LIBRARY_PATH


# ---------------------------------------------------------------------------
# Argument shapes: scalar, sequence, numpy array
# ---------------------------------------------------------------------------
#
# T and p are each a number, a sequence or iterable of numbers (list, tuple,
# range, generator, array.array, memoryview, ...) or a numpy array.  numpy is
# never imported here: an ndarray can only exist once its user imported
# numpy, so sys.modules tells.  Sequences are converted to array('d') (one C
# loop), numpy arrays to C-contiguous float64; the library's batch call then
# runs over the whole buffer.

def _numpy_array_type():
    np = sys.modules.get("numpy")   # an ndarray implies numpy is imported
    return getattr(np, "ndarray", None)


def _is_scalar(x):
    if isinstance(x, (int, float)):
        return True
    if isinstance(x, (str, bytes, bytearray)):
        return False
    if isinstance(x, numbers.Real):
        return True
    return hasattr(x, "__float__") and not hasattr(x, "__iter__")


def _describe(x):
    return "None" if x is None else type(x).__name__


def _shape_error(what, unit, x):
    return TypeError("%s must be a number or a sequence of numbers (%s), "
                     "got %s" % (what, unit, _describe(x)))


def _values(x, what, unit):
    """Classify an argument: ("scalar", float), ("numpy", C-contiguous
    float64 ndarray) or ("seq", array('d')).  TypeError names the argument
    (and the element) that is not a number."""
    if _is_scalar(x):
        try:
            return "scalar", float(x)
        except (TypeError, ValueError, OverflowError):
            raise _shape_error(what, unit, x) from None
    ndarray = _numpy_array_type()
    if ndarray is not None and isinstance(x, ndarray):
        np = sys.modules["numpy"]
        try:
            return "numpy", np.ascontiguousarray(x, dtype=np.float64)
        except (TypeError, ValueError):
            raise TypeError("%s must be a numpy array of numbers (%s), got "
                            "dtype %s" % (what, unit, x.dtype)) from None
    if x is None or isinstance(x, (str, bytes, bytearray,
                                   collections.abc.Mapping)):
        raise _shape_error(what, unit, x)
    if not isinstance(x, (collections.abc.Sequence, array.array,
                          memoryview)):
        try:
            x = list(x)              # iterators: read them once
        except TypeError:
            raise _shape_error(what, unit, x) from None
    try:
        return "seq", array.array("d", x)
    except (TypeError, ValueError, OverflowError, NotImplementedError):
        pass
    # Name the first element that is not a number.
    vals = array.array("d")
    for i, v in enumerate(x):
        if not _is_scalar(v):
            raise TypeError("%s[%d] must be a number (%s), got %s"
                            % (what, i, unit, _describe(v)))
        try:
            vals.append(float(v))
        except (TypeError, ValueError, OverflowError):
            raise TypeError("%s[%d] must be a number (%s), got %r"
                            % (what, i, unit, v)) from None
    return "seq", vals


def _scalar_arg(x, what, unit, where):
    """One number (for calls without a batch form, e.g. modes())."""
    kind, v = _values(x, what, unit)
    if kind != "scalar":
        raise TypeError("%s takes a single %s (%s), got %s"
                        % (where, what, unit, _describe(x)))
    return v


def _dptr(buf):
    """A double* to the data of an array('d') or a float64 ndarray."""
    if isinstance(buf, array.array):
        return (ctypes.c_double * len(buf)).from_buffer(buf)
    return buf.ctypes.data_as(ctypes.POINTER(ctypes.c_double))


class _Grid:
    """T and p broadcast against each other, flattened for the library.

    t: array('d') or float64 ndarray of n temperatures; p: one pressure
    (float) or, when pressures vary, a list of n floats.  finish() shapes
    a flat result like the input: a float for two numbers, a list for
    sequences, an ndarray when either input was a numpy array."""

    def __init__(self, T, p):
        tk, tv = _values(T, "T", "K")
        pk, pv = _values(p, "p", "Pa")
        self.scalar = tk == "scalar" and pk == "scalar"
        self.numpy = "numpy" in (tk, pk)
        self.shape = None
        if self.scalar:
            self.t, self.p, self.n = tv, pv, 1
            return
        if self.numpy:
            np = sys.modules["numpy"]
            ta = tv if tk == "numpy" else np.asarray(tv, dtype=np.float64)
            if pk == "scalar":
                self.shape = ta.shape
                self.t, self.p = ta.reshape(-1), pv
            else:
                pa = pv if pk == "numpy" else np.asarray(pv,
                                                         dtype=np.float64)
                try:
                    tb, pb = np.broadcast_arrays(ta, pa)
                except ValueError:
                    raise ValueError("T (shape %s) and p (shape %s) cannot "
                                     "be broadcast together"
                                     % (ta.shape, pa.shape)) from None
                self.shape = tb.shape
                self.t = np.ascontiguousarray(tb).reshape(-1)
                self.p = pb.reshape(-1).tolist()
            self.n = self.t.size
            self._compact_p()
            return
        if tk == "scalar":
            self.n = len(pv)
            self.t = array.array("d", [tv]) * self.n
            self.p = pv.tolist()
        elif pk == "scalar":
            self.n = len(tv)
            self.t, self.p = tv, pv
        else:
            if len(tv) != len(pv):
                raise ValueError("T and p must be of the same length (got %d "
                                 "temperatures and %d pressures), or one of "
                                 "them a single number" % (len(tv), len(pv)))
            self.n = len(tv)
            self.t, self.p = tv, pv.tolist()
        self._compact_p()

    def _compact_p(self):
        # One pressure repeated: a single batch call.
        if isinstance(self.p, list) and self.p and \
                self.p.count(self.p[0]) == len(self.p):
            self.p = self.p[0]
        elif isinstance(self.p, list) and not self.p:
            self.p = P_STANDARD

    def empty_out(self):
        if self.numpy:
            np = sys.modules["numpy"]
            return np.empty(self.n, dtype=np.float64)
        return array.array("d", [0.0]) * self.n

    def finish(self, out, scale=None):
        """The flat result `out` shaped like the input, each value divided by
        `scale` when given."""
        if self.numpy:
            if scale is not None:
                out /= scale
            return out.reshape(self.shape)
        if scale is not None:
            return list(map(scale.__rtruediv__, out))
        return out.tolist()


class _Handle:
    """Owns a C pointer and frees it exactly once.

    Freed by close() or when the Python object is collected; at interpreter
    shutdown nothing is freed (the process is ending, and a daemon thread
    might still be using the handle)."""

    def __init__(self, owner, ptr, free):
        self.ptr = ptr
        if free is not None:
            self._fin = weakref.finalize(owner, free, ptr)
            self._fin.atexit = False
        else:
            self._fin = None

    def close(self):
        self.ptr = None
        if self._fin is not None:
            self._fin()


class _Source:
    """What a Database was read from, kept so that each of its species can be
    rebuilt from its description in another process (pickle): the built-in
    set, or the species-file text.  Holds no C resource."""

    __slots__ = ("builtin", "text", "_entries", "__weakref__")

    def __init__(self, text=None, builtin=False):
        self.builtin = builtin
        self.text = text            # bytes, or None when not kept
        self._entries = None        # {name: entry dict}, parsed on demand

    def recipe(self, name):
        """A picklable description of species `name`: ("builtin", name) or
        ("text", species-file text holding only that entry, name); None
        when the text was not kept."""
        if self.builtin:
            return ("builtin", name)
        if self.text is None:
            return None
        entries = self._entries
        if entries is None:
            # The library has read this text, so it is valid JSON with
            # unique names; Python's json reads numbers to the same doubles.
            doc = json.loads(self.text)
            entries = {e["name"]: e for e in doc["species"]}
            self._entries = entries
        one = {"schema_version": 1, "species": [entries[name]]}
        return ("text", json.dumps(one), name)


# One built-in set per process for rebuilding unpickled built-in species
# (building it costs tens of milliseconds); created on first use.
_builtin_cache = []
_builtin_lock = threading.Lock()


def _cached_builtin():
    with _builtin_lock:
        if not _builtin_cache:
            _builtin_cache.append(Database.builtin())
        return _builtin_cache[0]


def _rebuild_species(recipe, models=()):
    """Inverse of Species.__reduce__: the species from its description, then
    with the models applied in order (Species.with_model)."""
    kind = recipe[0]
    if kind == "builtin":
        sp = _cached_builtin()[recipe[1]]
    elif kind == "text":
        sp = Database.from_string(recipe[1])[recipe[2]]
    else:
        raise ValueError("molq: unknown species description %r" % (kind,))
    for model in models:
        sp = sp.with_model(model)
    return sp


def _rebuild_builtin_database():
    return Database.builtin()


def _rebuild_database(text):
    return Database.from_string(text)


# ---------------------------------------------------------------------------
# Species
# ---------------------------------------------------------------------------

class _Immutable:
    """Shared by Species and Database: a context manager that closes the
    handle, and copies that are the object itself (the C handle is
    immutable, so sharing it is safe and no pointer is ever duplicated)."""

    def __enter__(self):
        return self

    def __exit__(self, *exc):
        self.close()

    def __copy__(self):
        return self

    def __deepcopy__(self, memo):
        return self


class Species(_Immutable):
    """One ideal-gas species (immutable).

    Obtain one from a :class:`Database` (``db["N2"]``; the species keeps its
    database alive) or build one with :meth:`Species.from_constants` or
    :meth:`Species.from_dict`.  Any number of threads may evaluate the same
    Species at once.

    Copying and pickling: ``copy.copy`` and ``copy.deepcopy`` return the
    species itself (it is immutable; the copy keeps the data alive as long
    as it is used, and ``close()`` applies to both names).  ``pickle`` stores
    the species' description (its species-file entry, or its name in the
    built-in set, plus any ``with_model`` applied) and rebuilds it on
    loading, so species can be sent to other processes (multiprocessing
    pools of any start method).

    Units: T in K, p in Pa (default ``P_STANDARD`` = 1e5 Pa), energies in
    J/mol, entropies and heat capacities in J/(mol K), their T-derivatives
    in J/(mol K^2).  Enthalpy scale: h(T) = dfH(298.15 K) + [H(T) -
    H(298.15 K)], with dfH = 0 for a species without a formation enthalpy.
    """

    def __init__(self, *args, **kwargs):
        raise TypeError("use Database[...], Species.from_constants(...) or "
                        "Species.from_dict(...)")

    @classmethod
    def _wrap(cls, ptr, owner=None, owned=False, src=None, src_name=None,
              models=()):
        self = object.__new__(cls)
        self._db = owner
        self._h = _Handle(self, ptr, _L.molq_species_free if owned else None)
        # Description for pickling: the source it was read from, its name
        # there and the models applied since (with_model).
        self._src = src
        self._src_name = src_name
        self._models = models
        self._private = False   # sole species of a database made for it
        return self

    # -- construction ------------------------------------------------------

    @classmethod
    def from_dict(cls, entry):
        """Build a species from one species-file entry: a dict with the keys
        of the species file (README, "Species files"; molar_mass in g/mol,
        spectroscopic constants in cm^-1, formation_enthalpy_298 in J/mol),
        e.g. ``{"name": "Qx", "structure": "atom", "molar_mass": 20.0}``.

        Raises:
            MolqError: the library rejected the entry; the message names the
                species and field, as for a species file.
            TypeError, ValueError: not a dict, or not expressible as JSON
                (a value that is not finite).
        """
        if not isinstance(entry, collections.abc.Mapping):
            raise TypeError("entry must be a dict with the keys of the "
                            "species file, not %s" % _describe(entry))
        try:
            text = json.dumps({"schema_version": 1, "species": [dict(entry)]},
                              allow_nan=False)
        except ValueError:
            raise ValueError("species %r: every number must be finite (NaN "
                             "and infinity cannot be given)"
                             % (entry.get("name"),)) from None
        except TypeError as exc:
            raise TypeError("species %r: %s" % (entry.get("name"), exc)) \
                from None
        db = Database.from_string(text)
        if len(db) != 1:     # cannot happen: the text holds one entry
            raise MolqError(EARG, "species text did not give one species")
        sp = db._at(0)
        sp._private = True
        return sp

    @classmethod
    def from_constants(cls, name, *, structure, molar_mass,
                       symmetry_number=1, rotational_constants=(),
                       vibrations=(), electronic_levels=(),
                       formation_enthalpy=None, formula=None,
                       rotor="corrected", source=None, model=None,
                       diatomic_states=None, dissociation_energy=None,
                       spin_isomers="equilibrium", odd_fraction=None,
                       anharmonicity=None, torsions=None,
                       rotational_weights=None, rotational_spin=None,
                       validated_range=None):
        """Build a species from molecular constants.

        The arguments are the keys of the species file (README, "Species
        files"; ``formation_enthalpy`` there is ``formation_enthalpy_298``)
        in Python form; the species is the one that file entry gives (the
        library reads the description through molq_db_read_string, which is
        also what pickling stores).

        Args:
            name: species name (1..255 bytes of UTF-8).
            structure: ``"atom"``, ``"linear"`` or ``"nonlinear"``.
            molar_mass: molar mass in **g/mol** (as in species files, e.g.
                28.0134 for N2).  ``None`` computes it from ``formula``
                (standard atomic weights).
            symmetry_number: rotational symmetry number (integer >= 1).
            rotational_constants: cm^-1; one value (B) for a linear
                molecule, three (A >= B >= C) for a nonlinear one.  A single
                number is accepted for a linear molecule.
            vibrations: vibrational modes, each a wavenumber in cm^-1, a
                ``(wavenumber, degeneracy)`` pair, a ``(wavenumber,
                degeneracy, harmonic)`` triple or a dict with the file's
                keys ``"wavenumber"``, ``"degeneracy"`` and ``"harmonic"``
                (the harmonic wavenumber omega_i of the anharmonic level
                sum).
            electronic_levels: each an energy above the ground level in
                cm^-1, an ``(energy, degeneracy)`` pair or a dict
                ``{"energy", "degeneracy"}``; when given they replace the
                default non-degenerate ground level.
            formation_enthalpy: standard enthalpy of formation at 298.15 K,
                J/mol, or None.
            formula: chemical formula text, e.g. ``"CO2"``.
            rotor: ``"corrected"`` (rigid rotor with quantum corrections,
                the default) or ``"classical"`` (textbook high-T rotor).
            source: free-text citation of the data.
            model: ``"rrho"`` or ``"levels"`` (see :func:`model_names`);
                None: ``"levels"`` when level data are given (diatomic
                states, anharmonicity, torsions, nuclear-spin weights of a
                top), else ``"rrho"``.
            diatomic_states: for the level sum of a diatomic, a list of
                dicts with the keys of the species file: ``"Te"`` (cm^-1,
                0 for the ground state; required), ``"degeneracy"``
                (default 1), ``"label"`` (text, not used), the term values
                either as named constants ``"we"``, ``"wexe"``, ``"weye"``,
                ``"weze"``, ``"Be"``, ``"alpha_e"``, ``"gamma_e"``,
                ``"De"``, ``"beta_e"``, ``"He"`` (cm^-1) or as
                ``"dunham"``: rows of Y_kl (row k = power of v + 1/2, at
                most 6; column l = power of J(J+1), at most 4), and
                ``"rotational_weights"``: ``[even, odd]`` nuclear-spin
                weights of even- and odd-J levels (H2: [0.25, 0.75]), and
                ``"spin_orbit"``: A in cm^-1, which makes the state a 2Pi
                state (Hill-Van Vleck levels, half-integer J; degeneracy
                4), and ``"re"``: the equilibrium distance in Angstrom,
                used only to check Be (a warning when they disagree).
            dissociation_energy: D0 of the ground state from its lowest
                level, cm^-1 (required by the levels model).
            spin_isomers: ``"equilibrium"`` (default) or ``"frozen"``: even-
                and odd-J molecules as a mixture of fixed composition, whose
                odd-J mole fraction is `odd_fraction` (0.75 for normal
                hydrogen).
            anharmonicity: polyatomics, a dict with any of ``"x"``:
                ``[[i, j, x_ij], ...]``, ``"g"``: ``[[i, g_ii], ...]``
                (doubly degenerate modes), ``"alpha"``: ``[[i, alpha_A,
                alpha_B, alpha_C] or [i, alpha], ...]`` (cm^-1; i, j index
                `vibrations`).
            torsions: hindered internal rotors, a list of dicts with
                ``"rotational_constant"`` (F, cm^-1) or ``"reduced_moment"``
                (amu A^2), ``"symmetry_number"`` (default 1), ``"barrier"``
                (a list of ``{"n": n, "V": V_n}`` dicts or ``(n, V_n)``
                pairs, cm^-1) and ``"replaces_vibration"`` (index into
                `vibrations`).
            rotational_weights: nonlinear molecules, nuclear-spin weights
                of the (Ka, Kc) parity classes, a dict ``{"ee", "eo",
                "oe", "oo"}`` or a sequence in that order (water: 0.25,
                0.75, 0.75, 0.25).
            rotational_spin: nonlinear molecules, instead of
                rotational_weights: ``{"group": "C3v" or "Td",
                "nuclear_spin": I}`` or a ``(group, I)`` pair (NH3: C3v,
                CH4: Td; I = 0.5 for protons).
            validated_range: ``(T_low, T_high)`` in K over which the data
                were checked against published tables (informational; see
                :attr:`validated_range`).

        Raises:
            MolqError: the library rejected a value; the message names the
                species and field.
            ValueError, TypeError: a malformed Python argument.
        """
        entry = _constants_entry(
            name, structure=structure, molar_mass=molar_mass,
            symmetry_number=symmetry_number,
            rotational_constants=rotational_constants, vibrations=vibrations,
            electronic_levels=electronic_levels,
            formation_enthalpy=formation_enthalpy, formula=formula,
            rotor=rotor, source=source, model=model,
            diatomic_states=diatomic_states,
            dissociation_energy=dissociation_energy,
            spin_isomers=spin_isomers, odd_fraction=odd_fraction,
            anharmonicity=anharmonicity, torsions=torsions,
            rotational_weights=rotational_weights,
            rotational_spin=rotational_spin,
            validated_range=validated_range)
        return cls.from_dict(entry)

    # -- lifetime, copying, pickling -----------------------------------------

    def close(self):
        """Release the species now (a species made by from_constants or
        from_dict, or by with_model, is freed; a database species just lets
        go of its database).  Further use raises ValueError.  Also happens
        on garbage collection."""
        self._h.close()
        if self._private and self._db is not None:
            self._db.close()
        self._db = None

    def __reduce__(self):
        self._ptr       # ValueError after close()
        recipe = None
        if self._src is not None:
            recipe = self._src.recipe(self._src_name)
        if recipe is None:
            raise TypeError("cannot pickle species %r: the text it was read "
                            "from was not kept (a species file larger than "
                            "the reading limit)" % (self.name,))
        return (_rebuild_species, (recipe, self._models))

    @property
    def _ptr(self):
        ptr = self._h.ptr
        if ptr is None or (self._db is not None and self._db._h.ptr is None):
            raise ValueError("molq.Species used after close() (of the "
                             "species or of its Database)")
        return ptr

    # -- descriptive properties ---------------------------------------------

    @property
    def name(self):
        """Species name."""
        return _decode(_L.molq_species_name(self._ptr))

    @property
    def formula(self):
        """Chemical formula as given ("" when none)."""
        return _decode(_L.molq_species_formula(self._ptr))

    @property
    def source(self):
        """Free-text source of the data ("" when none)."""
        return _decode(_L.molq_species_source(self._ptr))

    @property
    def charge(self):
        """Charge in elementary charges, from the formula (+1 for "N2+",
        -1 for "e-"; 0 when neutral or without a readable formula)."""
        return _L.molq_species_charge(self._ptr)

    @property
    def elements(self):
        """Element composition from the formula, a dict {symbol: atoms} in
        the formula's order ({"C": 1, "O": 2} for CO2; {} for the electron
        or without a readable formula)."""
        out = {}
        sym, n = ctypes.c_char_p(), ctypes.c_long()
        for i in range(_L.molq_species_element_count(self._ptr)):
            _L.molq_species_element(self._ptr, i, ctypes.byref(sym),
                                    ctypes.byref(n))
            out[_decode(sym.value)] = n.value
        return out

    @property
    def validated_range(self):
        """``(T_low, T_high)`` in K over which the data were checked against
        published tables, or None when the data state none.  Evaluation is
        not limited to it (molq.h, molq_species_validated_range)."""
        lo, hi = ctypes.c_double(), ctypes.c_double()
        st = _L.molq_species_validated_range(self._ptr, ctypes.byref(lo),
                                             ctypes.byref(hi))
        return (lo.value, hi.value) if st == 0 else None

    @property
    def molar_mass(self):
        """Molar mass in g/mol."""
        return _L.molq_species_molar_mass(self._ptr) * 1e3

    @property
    def model(self):
        """Name of the model the species uses: ``"rrho"`` or ``"levels"``
        (see :func:`model_names`)."""
        mid = _L.molq_species_model(self._ptr)
        return _MODEL_BY_ID.get(mid, "unknown model %d" % mid)


    def with_model(self, model):
        """A new Species from the same data with another model, e.g.
        ``db["N2"].with_model("rrho")`` to compare the rigid-rotor /
        harmonic result with the level sum.  A diatomic given only by its
        states gets B0, the fundamental G(1) - G(0) and the states' v = 0
        levels for ``"rrho"``.  The new species does not depend on this one
        (or its database).

        Raises:
            ValueError: unknown model name.
            MolqError: the data do not support the model (``EVALUE``; the
                message names the missing field).
        """
        mid = _model_id(model)
        out = ctypes.c_void_p()
        buf = _lib.errbuf()
        status = _L.molq_species_with_model(self._ptr, mid, ctypes.byref(out),
                                            buf, _lib.ERRLEN)
        if status != 0:
            _fail(status, buf, "species %r with model %r" % (self.name,
                                                             model))
        return Species._wrap(out.value, owned=True, src=self._src,
                             src_name=self._src_name,
                             models=self._models + (model,))

    @property
    def warnings(self):
        """The library's warnings about this species' data, a tuple of str,
        each naming the species and field (e.g. a molar mass more than 1 %
        off its formula's); empty when there are none."""
        return _warnings(self._ptr, "molq_species_warning_count",
                         "molq_species_warning")


    @property
    def t_min(self):
        """Lowest temperature in K at which every model of the species is
        valid (0.0 when there is no lower limit)."""
        return _L.molq_species_t_min(self._ptr)

    @property
    def has_formation_enthalpy(self):
        """True if the species carries a standard enthalpy of formation
        (otherwise h is the sensible enthalpy h(T) - h(298.15 K))."""
        return bool(_L.molq_species_has_formation_enthalpy(self._ptr))

    @property
    def mode_kinds(self):
        """Kinds of the species' modes in order, e.g. ``["translation",
        "rotation", "vibration", "electronic"]``."""
        ptr = self._ptr
        kinds = []
        kind = ctypes.c_int()
        for i in range(_L.molq_species_mode_count(ptr)):
            status = _L.molq_species_mode_kind(ptr, i, ctypes.byref(kind))
            if status != 0:
                _fail(status, None, "species %r: mode %d" % (self.name, i))
            kinds.append(_decode(_L.molq_mode_kind_name(kind.value)))
        return kinds

    def __repr__(self):
        if self._h.ptr is None:
            return "<molq.Species (closed)>"
        return ("<molq.Species %r formula=%r molar_mass=%.6g g/mol "
                "model=%s>" % (self.name, self.formula, self.molar_mass,
                               self.model))

    # -- evaluation ----------------------------------------------------------

    # -- evaluation ----------------------------------------------------------

    def _raise_eval(self, status, prop, T, p, per_mass=False, index=None):
        where = "species %r: %s%s at T=%r K, p=%r Pa" % (
            self.name, prop, " per mass" if per_mass else "", T, p)
        if index is not None:
            where += " (element %d)" % index
        if status == ERANGE:
            where += " (lowest valid T for this species: %r K)" % self.t_min
        _fail(status, None, where)

    def _scalar(self, fn, prop, pid, T, p, per_mass=False, index=None):
        T = float(T)
        out = ctypes.c_double()
        status = fn(self._ptr, T, p, pid, ctypes.byref(out))
        if status != 0:
            self._raise_eval(status, prop, T, p, per_mass, index)
        return out.value

    def _batch(self, ptr, prop, pid, p, tbuf, obuf, index, per_mass):
        """molq_eval_batch over tbuf into obuf (equal lengths); on failure
        the first offending element (position index[j]) is reported."""
        status = _L.molq_eval_batch(ptr, pid, p, _dptr(tbuf), 1, _dptr(obuf),
                                    1, len(obuf))
        if status != 0:
            for j, i in enumerate(index):
                self._scalar(_L.molq_eval, prop, pid, tbuf[j], p, per_mass, i)
            self._raise_eval(status, prop, "(batch)", p, per_mass)

    def _run(self, prop, pid, grid, per_mass=False):
        """prop per mole at every point of a _Grid: a flat buffer."""
        ptr = self._ptr
        out = grid.empty_out()
        n = grid.n
        if n == 0:
            return out
        if not isinstance(grid.p, list):
            self._batch(ptr, prop, pid, grid.p, grid.t, out, range(n),
                        per_mass)
            return out
        # Pressures vary: one batch per distinct pressure (the library's
        # batch runs at one p).
        groups = {}
        for i, pv in enumerate(grid.p):
            groups.setdefault(pv, []).append(i)
        t = grid.t
        for pv, idx in groups.items():
            if len(idx) == 1:
                i = idx[0]
                out[i] = self._scalar(_L.molq_eval, prop, pid, t[i], pv,
                                      per_mass, i)
                continue
            tb = array.array("d", [t[i] for i in idx])
            ob = array.array("d", [0.0]) * len(idx)
            self._batch(ptr, prop, pid, pv, tb, ob, idx, per_mass)
            for j, i in enumerate(idx):
                out[i] = ob[j]
        return out

    def eval(self, prop, T, p=P_STANDARD):
        """Evaluate property `prop` per mole at temperature(s) T and
        pressure(s) p.

        Args:
            prop: a property name from :func:`molq.property_names`, e.g.
                ``"cp"`` (J/(mol K)), ``"h"`` (J/mol), ``"s"`` (J/(mol K)),
                ``"h_minus_h298"`` (J/mol), ``"lnq"`` (dimensionless).
            T: temperature in K: a number, any sequence or iterable of
                numbers (list, tuple, range, array.array, ...), or a numpy
                array.
            p: pressure in Pa, in the same forms (default 1e5 Pa).  A
                number is used with every T (and one T with every p); two
                sequences pair up element by element and must be of the
                same length; numpy arrays broadcast.

        Returns:
            A float for two numbers, a list of floats for sequences, a numpy
            float64 array (of the broadcast shape) when T or p is a numpy
            array.

        Raises:
            ValueError: unknown property name; T and p of different lengths.
            TypeError: T or p is not a number or a sequence of numbers.
            MolqError: T or p not finite and positive (``EDOMAIN``), or T
                below :attr:`t_min` (``ERANGE``); the message gives the
                value (and its position in a sequence).
        """
        pid = _prop_id(prop)
        grid = _Grid(T, p)
        if grid.scalar:
            return self._scalar(_L.molq_eval, prop, pid, grid.t, grid.p)
        return grid.finish(self._run(prop, pid, grid))

    def eval_per_mass(self, prop, T, p=P_STANDARD):
        """As :meth:`eval`, per unit mass: extensive properties divided by
        the molar mass, giving J/(kg K), J/kg, J/(kg K^2); ``"lnq"`` and
        ``"dgRT_dT"`` are returned unchanged.  T and p as for :meth:`eval`;
        the values equal the library's molq_eval_per_mass to the last
        bit."""
        pid = _prop_id(prop)
        grid = _Grid(T, p)
        if grid.scalar:
            return self._scalar(_L.molq_eval_per_mass, prop, pid, grid.t,
                                grid.p, per_mass=True)
        out = self._run(prop, pid, grid, per_mass=True)
        # molq.h: molq_eval_per_mass divides by the molar mass (kg/mol)
        # except for these two; the same division here, over the buffer.
        if pid in _UNSCALED or grid.n == 0:
            return grid.finish(out)
        mass = _L.molq_species_molar_mass(self._ptr)
        lo, hi = (out.min(), out.max()) if grid.numpy else (min(out),
                                                             max(out))
        if not (math.isfinite(lo / mass) and math.isfinite(hi / mass)):
            # An absurdly small molar mass: the library reports it.
            t, p_ = grid.t, grid.p
            for i in range(grid.n):
                self._scalar(_L.molq_eval_per_mass, prop, pid, t[i],
                             p_[i] if isinstance(p_, list) else p_,
                             per_mass=True, index=i)
        return grid.finish(out, mass)

    def eval_many(self, props, T, p=P_STANDARD):
        """Several properties at the same states (T in K, p in Pa, each a
        number or a sequence or array as for :meth:`eval`).  Returns a dict
        {name: value} in the order of `props` (a single name is accepted
        too); each value is a float for one state, else a list or numpy
        array as :meth:`eval` gives it.  For one state the partition
        function is summed once."""
        if isinstance(props, (str, bytes)):
            props = [props]
        props = list(props)
        ids = [_prop_id(name) for name in props]
        grid = _Grid(T, p)
        n = len(ids)
        if n == 0:
            return {}
        if not grid.scalar:
            return {name: grid.finish(self._run(name, pid, grid))
                    for name, pid in zip(props, ids)}
        idarr = (ctypes.c_int * n)(*ids)
        out = (ctypes.c_double * n)()
        status = _L.molq_eval_many(self._ptr, grid.t, grid.p, idarr, n, out)
        if status != 0:
            self._raise_eval(status, ",".join(props), grid.t, grid.p)
        return dict(zip(props, out))

    def spin_conversion(self, T):
        """Ortho-para conversion enthalpy h_frozen - h_equilibrium in J/mol
        at temperature(s) T in K: the heat released per mole when the
        frozen even/odd-J mixture (the species' own, or else the ground
        state's high-temperature ratio, e.g. normal hydrogen) relaxes to
        spin equilibrium at T.  Diatomics with the levels model only.

        T may be a number (float back), a sequence (list back) or a numpy
        array (array of T's shape back).

        Raises:
            MolqError: the species is not a diatomic with the levels model
                (``EARG``), or T is not finite and positive (``EDOMAIN``).
        """
        ptr = self._ptr
        out = ctypes.c_double()

        def one(t):
            t = float(t)
            status = _L.molq_eval_spin_conversion(ptr, t, ctypes.byref(out))
            if status != 0:
                model = self.model
                if status == EARG and model != "levels":
                    raise MolqError(status, "species %r uses model %r; the "
                                    "spin conversion enthalpy needs model "
                                    "'levels' (see with_model)"
                                    % (self.name, model))
                if status == EARG:
                    raise MolqError(status, "species %r: no spin conversion "
                                    "enthalpy; the library gives it for "
                                    "diatomic level sums (diatomic_states) "
                                    "only" % (self.name,))
                _fail(status, None, "species %r: spin conversion at T=%r K"
                      % (self.name, t))
            return out.value

        kind, tv = _values(T, "T", "K")
        if kind == "scalar":
            return one(tv)
        if kind == "numpy":
            np = sys.modules["numpy"]
            res = np.empty(tv.shape, dtype=np.float64)
            flat = res.reshape(-1)
            for i, t in enumerate(tv.reshape(-1).tolist()):
                flat[i] = one(t)
            return res
        return [one(t) for t in tv]

    def modes(self, T, p=P_STANDARD):
        """Per-mode breakdown at one state (T in K, p in Pa, numbers).

        Returns a list with one dict per mode (translation, rotation,
        vibration, electronic, as the species has them; translation and
        rovibronic for the levels model)::

            {"kind": "rotation",
             "lnq": ln q of the mode (translation includes the kT/p volume),
             "u":   thermal energy above the mode's ground level, J/mol,
             "cv":  heat capacity contribution, J/(mol K),
             "s":   entropy contribution, J/(mol K) (translation carries the
                    +R of the ideal-gas entropy and the pressure)}

        The lnq, cv and s entries add up to the species' values, the u
        entries to h - h(0 K) - RT.
        """
        T = _scalar_arg(T, "T", "K", "modes()")
        p = _scalar_arg(p, "p", "Pa", "modes()")
        ptr = self._ptr
        kinds = self.mode_kinds
        result = []
        out = ctypes.c_double()
        for i, kind in enumerate(kinds):
            entry = {"kind": kind}
            for key, pid in (("lnq", _MOLQ_LNQ), ("u", _MOLQ_U),
                             ("cv", _MOLQ_CV), ("s", _MOLQ_S)):
                status = _L.molq_eval_mode(ptr, i, T, p, pid,
                                           ctypes.byref(out))
                if status != 0:
                    self._raise_eval(status, "mode %d (%s) %s" % (i, kind,
                                                                  key), T, p)
                entry[key] = out.value
            result.append(entry)
        return result


# ---------------------------------------------------------------------------
# from_constants: Python arguments -> one species-file entry
# ---------------------------------------------------------------------------

def _as_int(value, field):
    if isinstance(value, bool):
        raise TypeError("%s must be an integer, not %r" % (field, value))
    try:
        i = operator.index(value)
    except TypeError:
        raise TypeError("%s must be an integer, not %r" % (field, value)) \
            from None
    # Out-of-range values are left for the library to reject by name.
    return max(-_INT_CLAMP, min(_INT_CLAMP, i))


class _Entry:
    """Conversions of one species' arguments, with errors naming the
    species and field."""

    def __init__(self, name):
        self.who = "species %r" % (name,)

    def num(self, value, field):
        """A finite float (JSON has no NaN or infinity; the library would
        refuse them anyway)."""
        if isinstance(value, bool) or not _is_scalar(value):
            raise TypeError("%s: %s must be a number, not %s"
                            % (self.who, field, _describe(value)))
        try:
            x = float(value)
        except (TypeError, ValueError, OverflowError):
            raise TypeError("%s: %s must be a number, not %r"
                            % (self.who, field, value)) from None
        if not math.isfinite(x):
            raise MolqError(EVALUE, "%s: field '%s': must be a finite number "
                            "(got %r)" % (self.who, field, x))
        return x

    def text(self, value, field):
        if isinstance(value, bytes):
            try:
                return value.decode("utf-8")
            except UnicodeDecodeError:
                raise ValueError("%s: %s is not valid UTF-8"
                                 % (self.who, field)) from None
        if not isinstance(value, str):
            raise TypeError("%s must be a str, not %s"
                            % (field, type(value).__name__))
        return value

    def seq(self, value, field, what):
        if _is_scalar(value) or value is None or \
                isinstance(value, (str, bytes, collections.abc.Mapping)):
            raise TypeError("%s: %s must be %s, not %s"
                            % (self.who, field, what, _describe(value)))
        try:
            return list(value)
        except TypeError:
            raise TypeError("%s: %s must be %s, not %s"
                            % (self.who, field, what,
                               _describe(value))) from None

    def keys(self, mapping, allowed, field):
        unknown = [k for k in mapping if k not in allowed]
        if unknown:
            raise ValueError("%s: unknown key %r (known: %s)"
                             % (field, unknown[0], ", ".join(allowed)))

    def items(self, items, field, value_key, extra_key=None):
        """Numbers, (value, degeneracy[, extra]) tuples or dicts with the
        file's keys -> the file's list of dicts."""
        if _is_scalar(items):
            items = (items,)
        allowed = (value_key, "degeneracy") + ((extra_key,) if extra_key
                                               else ())
        out = []
        for i, item in enumerate(self.seq(items, field, "a list")):
            where = "%s[%d]" % (field, i)
            if _is_scalar(item):
                out.append({value_key: self.num(item, where)})
                continue
            if isinstance(item, collections.abc.Mapping):
                self.keys(item, allowed, where)
                if value_key not in item:
                    raise ValueError("%s: '%s' missing" % (where, value_key))
                parts = [item[value_key], item.get("degeneracy"),
                         item.get(extra_key) if extra_key else None]
            else:
                try:
                    parts = list(item)
                except TypeError:
                    parts = None
                if parts is None or not 2 <= len(parts) <= len(allowed):
                    raise TypeError("%s must be a number, a (%s) tuple or a "
                                    "dict, not %r"
                                    % (where, ", ".join(allowed), item))
                parts += [None] * (3 - len(parts))
            d = {value_key: self.num(parts[0], where + "." + value_key)}
            if parts[1] is not None:
                d["degeneracy"] = _as_int(parts[1], where + " degeneracy")
            if parts[2] is not None:
                d[extra_key] = self.num(parts[2], where + "." + extra_key)
            out.append(d)
        return out

    def state(self, i, state):
        """diatomic_states[i] (a dict with the species-file keys)."""
        field = "diatomic_states[%d]" % i
        if not isinstance(state, collections.abc.Mapping):
            raise TypeError("%s must be a dict, not %s"
                            % (field, type(state).__name__))
        self.keys(state, _STATE_KEYS, field)
        if "Te" not in state:
            raise ValueError("%s: 'Te' missing (0 for the ground state)"
                             % field)
        named = [k for k in _NAMED_CONSTANTS if k in state]
        if named and "dunham" in state:
            raise ValueError("%s: give either 'dunham' or the named "
                             "constants (%s), not both"
                             % (field, ", ".join(named)))
        out = {}
        if "label" in state:
            if not isinstance(state["label"], str):
                raise TypeError("%s.label must be a str" % field)
            out["label"] = state["label"]
        out["Te"] = self.num(state["Te"], field + ".Te")
        if "degeneracy" in state:
            out["degeneracy"] = _as_int(state["degeneracy"],
                                        field + ".degeneracy")
        for key in named:
            out[key] = self.num(state[key], "%s.%s" % (field, key))
        if "dunham" in state:
            rows = state["dunham"]
            if _is_scalar(rows) or isinstance(rows, (str, bytes)) or \
                    len(rows) > _DUNHAM_ROWS:
                raise ValueError("%s.dunham must be at most %d rows (powers "
                                 "of v + 1/2) of at most %d numbers (powers "
                                 "of J(J+1))"
                                 % (field, _DUNHAM_ROWS, _DUNHAM_COLS))
            matrix = []
            for k, row in enumerate(rows):
                if _is_scalar(row) or isinstance(row, (str, bytes)) or \
                        len(row) > _DUNHAM_COLS:
                    raise ValueError("%s.dunham[%d] must be a list of at "
                                     "most %d numbers"
                                     % (field, k, _DUNHAM_COLS))
                matrix.append([self.num(y, "%s.dunham[%d][%d]"
                                        % (field, k, l))
                               for l, y in enumerate(row)])
            out["dunham"] = matrix
        if "rotational_weights" in state:
            w = state["rotational_weights"]
            if _is_scalar(w) or isinstance(w, (str, bytes)) or len(w) != 2:
                raise ValueError("%s.rotational_weights must be [even-J "
                                 "weight, odd-J weight]" % field)
            out["rotational_weights"] = [
                self.num(x, field + ".rotational_weights") for x in w]
        if "spin_orbit" in state:
            out["spin_orbit"] = self.num(state["spin_orbit"],
                                         field + ".spin_orbit")
        if "re" in state:
            out["re"] = self.num(state["re"], field + ".re")
        return out

    def anharmonicity(self, anh):
        field = "anharmonicity"
        if not isinstance(anh, collections.abc.Mapping):
            raise TypeError("%s: %s must be a dict with any of x, g, alpha, "
                            "not %s" % (self.who, field, _describe(anh)))
        self.keys(anh, ("x", "g", "alpha"), field)
        out = {}
        for key, nidx in (("x", 2), ("g", 1), ("alpha", 1)):
            if key not in anh:
                continue
            rows = []
            for k, row in enumerate(self.seq(anh[key], "%s.%s" % (field, key),
                                             "a list of lists")):
                where = "%s.%s[%d]" % (field, key, k)
                row = self.seq(row, where, "a list [mode index(es), "
                               "value(s)]")
                rows.append([_as_int(v, where + " mode index") if m < nidx
                             else self.num(v, where)
                             for m, v in enumerate(row)])
            out[key] = rows
        return out

    def torsion(self, i, tor):
        field = "torsions[%d]" % i
        if not isinstance(tor, collections.abc.Mapping):
            raise TypeError("%s must be a dict, not %s"
                            % (field, _describe(tor)))
        self.keys(tor, _TORSION_KEYS, field)
        out = {}
        for key in ("rotational_constant", "reduced_moment"):
            if key in tor:
                out[key] = self.num(tor[key], "%s.%s" % (field, key))
        for key in ("symmetry_number", "replaces_vibration"):
            if key in tor:
                out[key] = _as_int(tor[key], "%s.%s" % (field, key))
        if "barrier" in tor:
            terms = []
            for k, term in enumerate(self.seq(tor["barrier"],
                                              field + ".barrier",
                                              "a list of {n, V}")):
                where = "%s.barrier[%d]" % (field, k)
                if isinstance(term, collections.abc.Mapping):
                    self.keys(term, ("n", "V"), where)
                    if "n" not in term or "V" not in term:
                        raise ValueError("%s needs 'n' and 'V'" % where)
                    n, v = term["n"], term["V"]
                else:
                    pair = self.seq(term, where, "{'n': n, 'V': V} or (n, V)")
                    if len(pair) != 2:
                        raise TypeError("%s must be {'n': n, 'V': V} or "
                                        "(n, V)" % where)
                    n, v = pair
                terms.append({"n": _as_int(n, where + ".n"),
                              "V": self.num(v, where + ".V")})
            out["barrier"] = terms
        return out

    def top_weights(self, w):
        field = "rotational_weights"
        keys = ("ee", "eo", "oe", "oo")
        if isinstance(w, collections.abc.Mapping):
            self.keys(w, keys, field)
            missing = [k for k in keys if k not in w]
            if missing:
                raise ValueError("%s: %r missing (give ee, eo, oe, oo)"
                                 % (field, missing[0]))
            return {k: self.num(w[k], "%s.%s" % (field, k)) for k in keys}
        vals = self.seq(w, field, "a dict {ee, eo, oe, oo} or four numbers")
        if len(vals) != 4:
            raise ValueError("%s must be four weights (ee, eo, oe, oo), got "
                             "%d" % (field, len(vals)))
        return {k: self.num(v, "%s.%s" % (field, k))
                for k, v in zip(keys, vals)}

    def spin_group(self, g):
        field = "rotational_spin"
        if isinstance(g, collections.abc.Mapping):
            self.keys(g, ("group", "nuclear_spin"), field)
            if "group" not in g or "nuclear_spin" not in g:
                raise ValueError("%s needs 'group' (C3v or Td) and "
                                 "'nuclear_spin'" % field)
            group, spin = g["group"], g["nuclear_spin"]
        else:
            pair = self.seq(g, field, "a dict {group, nuclear_spin} or a "
                            "(group, nuclear_spin) pair")
            if len(pair) != 2:
                raise ValueError("%s must be (group, nuclear_spin)" % field)
            group, spin = pair
        return {"group": self.text(group, field + ".group"),
                "nuclear_spin": self.num(spin, field + ".nuclear_spin")}


_TORSION_KEYS = ("rotational_constant", "reduced_moment", "symmetry_number",
                 "barrier", "replaces_vibration")


def _constants_entry(name, *, structure, molar_mass, symmetry_number,
                     rotational_constants, vibrations, electronic_levels,
                     formation_enthalpy, formula, rotor, source, model,
                     diatomic_states, dissociation_energy, spin_isomers,
                     odd_fraction, anharmonicity, torsions,
                     rotational_weights, rotational_spin, validated_range):
    """The species-file entry (a dict) of Species.from_constants."""
    c = _Entry(name)
    entry = {"name": c.text(name, "name")}
    if structure not in _STRUCTURES:
        raise ValueError("structure must be one of %s, not %r"
                         % (", ".join(_STRUCTURES), structure))
    if rotor not in _ROTORS:
        raise ValueError("rotor must be one of %s, not %r"
                         % (", ".join(_ROTORS), rotor))
    if model is not None:
        _model_id(model)             # ValueError naming the known models
    if spin_isomers not in ("equilibrium", "frozen"):
        raise ValueError("spin_isomers must be 'equilibrium' or "
                         "'frozen', not %r" % (spin_isomers,))
    if spin_isomers == "frozen" and odd_fraction is None:
        raise ValueError("spin_isomers='frozen' needs odd_fraction, the "
                         "mole fraction of odd-J molecules (0.75 for "
                         "normal hydrogen)")
    if spin_isomers == "equilibrium" and odd_fraction is not None:
        raise ValueError("odd_fraction is only meaningful with "
                         "spin_isomers='frozen'")
    if diatomic_states is None:
        diatomic_states = ()
    elif isinstance(diatomic_states, collections.abc.Mapping):
        raise TypeError("diatomic_states must be a list of dicts (one "
                        "per electronic state), not a single dict")
    if formula is not None:
        entry["formula"] = c.text(formula, "formula")
    if molar_mass is not None:
        entry["molar_mass"] = c.num(molar_mass, "molar_mass")
    entry["structure"] = structure
    entry["symmetry_number"] = _as_int(symmetry_number, "symmetry_number")
    if _is_scalar(rotational_constants):
        rotational_constants = (rotational_constants,)
    rc = [c.num(b, "rotational_constants")
          for b in c.seq(rotational_constants, "rotational_constants",
                         "a list of numbers")]
    if rc:
        entry["rotational_constants"] = rc
    entry["rotor"] = rotor
    vib = c.items(vibrations, "vibrations", "wavenumber", "harmonic")
    if vib:
        entry["vibrations"] = vib
    lev = c.items(electronic_levels, "electronic_levels", "energy")
    if lev:
        entry["electronic_levels"] = lev
    if formation_enthalpy is not None:
        entry["formation_enthalpy_298"] = c.num(formation_enthalpy,
                                                "formation_enthalpy")
    if source is not None:
        entry["source"] = c.text(source, "source")
    if validated_range is not None:
        entry["validated_range"] = [
            c.num(x, "validated_range") for x in
            c.seq(validated_range, "validated_range", "a (T_low, T_high) pair")]
    if model is not None:
        entry["model"] = model
    if dissociation_energy is not None:
        entry["dissociation_energy"] = c.num(dissociation_energy,
                                             "dissociation_energy")
    if spin_isomers == "frozen":
        entry["spin_isomers"] = "frozen"
        entry["odd_fraction"] = c.num(odd_fraction, "odd_fraction")
    if anharmonicity is not None:
        entry["anharmonicity"] = c.anharmonicity(anharmonicity)
    if torsions is not None:
        if isinstance(torsions, collections.abc.Mapping):
            raise TypeError("torsions must be a list of dicts (one per "
                            "internal rotor), not a single dict")
        entry["torsions"] = [c.torsion(i, t) for i, t in enumerate(
            c.seq(torsions, "torsions", "a list of dicts"))]
    if rotational_weights is not None:
        entry["rotational_weights"] = c.top_weights(rotational_weights)
    if rotational_spin is not None:
        entry["rotational_spin"] = c.spin_group(rotational_spin)
    states = [c.state(i, s) for i, s in enumerate(
        c.seq(diatomic_states, "diatomic_states", "a list of dicts"))]
    if states:
        entry["diatomic_states"] = states
    return entry


def _warnings(ptr, count_name, item_name):
    """The handle's warnings (molq_*_warning_count / molq_*_warning)."""
    count, item = getattr(_L, count_name), getattr(_L, item_name)
    return tuple(_decode(item(ptr, i)) for i in range(count(ptr)))


def _make_shortcut(prop, what, unit):
    def method(self, T, p=P_STANDARD):
        return self.eval(prop, T, p)
    method.__name__ = prop
    method.__qualname__ = "Species." + prop
    method.__doc__ = (
        "%s in %s at T in K (number, sequence or numpy array) and p in Pa "
        "(default 1e5).  Same as ``eval(%r, T, p)``." % (what, unit, prop))
    return method


for _prop, _what in (
        ("cp", "Isobaric heat capacity"),
        ("cv", "Isochoric heat capacity"),
        ("h", "Enthalpy dfH(298.15) + [H(T) - H(298.15)]"),
        ("u", "Internal energy u = h - RT"),
        ("s", "Entropy at p"),
        ("g", "Gibbs energy g = h - T s"),
        ("a", "Helmholtz energy a = u - T s"),
        ("lnq", "ln(q/N), molecular partition function per molecule"),
        ("gef", "Gibbs energy function -(g - h(298.15))/T"),
        ("h_minus_h298", "Sensible enthalpy h(T) - h(298.15 K)"),
        ("h_minus_h0", "Enthalpy above 0 K, h(T) - h(0 K)"),
        ("dcp_dT", "Temperature derivative of cp")):
    if _prop in _PROPS:
        setattr(Species, _prop, _make_shortcut(_prop, _what,
                                               property_unit(_prop)))
del _prop, _what



# ---------------------------------------------------------------------------
# Database
# ---------------------------------------------------------------------------

#: The library's size limit of a species file (README, "Limits"): 64 MiB.
#: Larger files are left to the library to refuse with its own message.
_MAX_FILE_BYTES = 64 * 1024 * 1024


class UnknownSpeciesError(KeyError):
    """KeyError for a species name a Database does not hold; the message
    suggests near names ("no species 'n2' ...; did you mean 'N2'?").

    Attributes: ``name`` (the name asked for), ``suggestions`` (a tuple of
    names of the database, best first; may be empty)."""

    def __init__(self, message, name=None, suggestions=()):
        super().__init__(message)
        self.message = message
        self.name = name
        self.suggestions = tuple(suggestions)

    def __str__(self):
        return self.message

    def __reduce__(self):
        return (type(self), (self.message, self.name, self.suggestions))


def _suggest(name, names):
    """Names of `names` close to `name`: equal up to case first, then the
    nearest spellings (difflib), best first."""
    key = name.casefold()
    same = [n for n in names if n.casefold() == key]
    if same:
        return same
    folded = {}
    for n in names:
        folded.setdefault(n.casefold(), []).append(n)
    near = difflib.get_close_matches(key, list(folded), n=3, cutoff=0.6)
    return [n for f in near for n in folded[f]]


def _no_species(name, names):
    if not isinstance(name, (str, bytes)):
        return UnknownSpeciesError("species names are str, not %s"
                                   % type(name).__name__, name)
    text = name.decode("utf-8", "replace") if isinstance(name, bytes) \
        else name
    hints = _suggest(text, names)
    msg = "no species %r in this database" % (text,)
    if hints:
        msg += "; did you mean %s?" % " or ".join(repr(h) for h in hints)
        if any(h.casefold() == text.casefold() for h in hints):
            msg += " (names are case-sensitive)"
    elif names:
        shown = names[:20]
        msg += " (%d species: %s%s)" % (len(names), ", ".join(shown),
                                        ", ..." if len(names) > 20 else "")
    else:
        msg += " (it holds no species)"
    return UnknownSpeciesError(msg, text, hints)


class Database(_Immutable):
    """An immutable set of species read from JSON (or the built-in starter
    set).  ``len(db)``, ``db.names()``, ``db["N2"]``, ``"N2" in db`` and
    iteration (species in file order) work as for a mapping; an unknown
    name raises :class:`UnknownSpeciesError` (a KeyError) suggesting near
    names.  Species taken from a database keep it alive.

    ``copy.copy``/``copy.deepcopy`` return the database itself (it is
    immutable); ``pickle`` stores the text it was read from (or that it is
    the built-in set) and reads it again on loading."""

    def __init__(self, *args, **kwargs):
        raise TypeError("use Database.builtin(), Database.from_file(path) or "
                        "Database.from_string(text)")

    @classmethod
    def _wrap(cls, ptr, source):
        self = object.__new__(cls)
        self._h = _Handle(self, ptr, _L.molq_db_free)
        self._source = source
        return self

    @classmethod
    def builtin(cls):
        """The starter species set compiled into the library (Ar, O, H2,
        N2, O2, CO, CO2, H2O, ..., each with its published source)."""
        out = ctypes.c_void_p()
        buf = _lib.errbuf()
        status = _L.molq_db_builtin(ctypes.byref(out), buf, _lib.ERRLEN)
        if status != 0:
            _fail(status, buf, "built-in species set")
        return cls._wrap(out.value, _Source(builtin=True))

    @classmethod
    def from_file(cls, path):
        """Read a species file (JSON, schema version 1; molar_mass in g/mol,
        constants in cm^-1, formation_enthalpy_298 in J/mol).  The text is
        kept with the database (for pickling its species).

        Raises MolqError whose message gives the line and column of a syntax
        error, or the species and field of a bad value."""
        bpath = os.fsencode(path)
        try:
            with open(bpath, "rb") as f:
                data = f.read(_MAX_FILE_BYTES + 1)
        except OSError:
            data = None
        if data is not None and len(data) <= _MAX_FILE_BYTES:
            return cls._read(data, "species file %r" % os.fsdecode(bpath))
        # Unreadable or too large: the library's own message.
        out = ctypes.c_void_p()
        buf = _lib.errbuf()
        status = _L.molq_db_read_file(bpath, ctypes.byref(out), buf,
                                      _lib.ERRLEN)
        if status != 0:
            _fail(status, buf, "species file %r" % os.fsdecode(bpath))
        return cls._wrap(out.value, _Source())

    @classmethod
    def from_string(cls, text):
        """As :meth:`from_file`, from JSON text (str or UTF-8 bytes)."""
        data = text.encode("utf-8") if isinstance(text, str) else bytes(text)
        return cls._read(data, "species text")

    @classmethod
    def _read(cls, data, what):
        out = ctypes.c_void_p()
        buf = _lib.errbuf()
        status = _L.molq_db_read_string(data, len(data), ctypes.byref(out),
                                        buf, _lib.ERRLEN)
        if status != 0:
            _fail(status, buf, what)
        return cls._wrap(out.value, _Source(text=data))

    def close(self):
        """Free the database now.  Species taken from it become unusable
        (ValueError); without close() it lives as long as any of them."""
        self._h.close()

    def __reduce__(self):
        self._ptr       # ValueError after close()
        if self._source.builtin:
            return (_rebuild_builtin_database, ())
        if self._source.text is None:
            raise TypeError("cannot pickle this molq.Database: its text was "
                            "not kept (a file larger than the reading "
                            "limit)")
        return (_rebuild_database, (self._source.text,))

    @property
    def _ptr(self):
        if self._h.ptr is None:
            raise ValueError("molq.Database used after close()")
        return self._h.ptr

    def __len__(self):
        return _L.molq_db_count(self._ptr)

    def _species(self, ptr):
        sp = Species._wrap(ptr, owner=self, src=self._source)
        sp._src_name = sp.name
        return sp

    def _at(self, index):
        ptr = _L.molq_db_species(self._ptr, index)
        if not ptr:
            raise IndexError(index)
        return self._species(ptr)

    def __iter__(self):
        for i in range(len(self)):
            yield self._at(i)

    def names(self):
        """Species names in file order."""
        db = self._ptr
        return [_decode(_L.molq_species_name(_L.molq_db_species(db, i)))
                for i in range(_L.molq_db_count(db))]

    def _find(self, name):
        """The species called `name`, or None."""
        if not isinstance(name, (str, bytes)):
            return None
        key = _encode_name(name, "name")
        if key is None:
            return None
        out = ctypes.c_void_p()
        status = _L.molq_db_find(self._ptr, key, ctypes.byref(out))
        if status == ENOTFOUND:
            return None
        if status != 0:
            _fail(status, None, "species %r" % (name,))
        return self._species(out.value)

    def __getitem__(self, name):
        sp = self._find(name)
        if sp is None:
            raise _no_species(name, self.names())
        return sp

    def by_formula(self, formula, default=None):
        """The first species (in file order) whose formula is exactly
        `formula` (as written in the data, e.g. "CO2", "N2+"; exact text,
        case-sensitive), or `default` when none has it ("" and a text
        holding a NUL find nothing).  TypeError unless str or bytes."""
        key = _encode_name(formula, "formula")
        if key is None:
            return default
        out = ctypes.c_void_p()
        status = _L.molq_db_find_formula(self._ptr, key, ctypes.byref(out))
        if status == ENOTFOUND:
            return default
        if status != 0:
            _fail(status, None, "formula %r" % (formula,))
        return self._species(out.value)

    def get(self, name, default=None):
        """``db[name]``, or `default` when there is no such species."""
        sp = self._find(name)
        return default if sp is None else sp

    def __contains__(self, name):
        return self._find(name) is not None

    @property
    def warnings(self):
        """The library's warnings about the file (a missing schema_version)
        and then about each species, a tuple of str; the database is
        complete and usable, the warnings say what to check."""
        return _warnings(self._ptr, "molq_db_warning_count",
                         "molq_db_warning")

    def __repr__(self):
        if self._h.ptr is None:
            return "<molq.Database (closed)>"
        return "<molq.Database %d species: %s>" % (len(self),
                                                   ", ".join(self.names()))
