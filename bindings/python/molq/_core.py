"""Pythonic classes over the molq C API (internal module; import ``molq``).

Units everywhere: T in K, p in Pa, energies in J/mol, entropies and heat
capacities in J/(mol K), their T-derivatives in J/(mol K^2); molar mass in
g/mol on the Python side (kg/mol in the C library); spectroscopic inputs
(rotational constants, vibrational wavenumbers, electronic level energies)
in cm^-1.
"""

import collections.abc
import ctypes
import numbers
import operator
import os
import sys
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
               "dunham", "spin_orbit") + tuple(_NAMED_CONSTANTS)
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
    if isinstance(text, bytes):
        return text
    if not isinstance(text, str):
        raise TypeError("%s must be a str, not %s" % (what,
                                                      type(text).__name__))
    return text.encode("utf-8")


# ---------------------------------------------------------------------------
# Properties
# ---------------------------------------------------------------------------

_PROPS = _name_table(_L.molq_property_count, _L.molq_property_name)


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


def _as_pressure(p):
    if not _is_scalar(p):
        raise TypeError("p must be a single pressure in Pa, not %s"
                        % type(p).__name__)
    return float(p)


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


# ---------------------------------------------------------------------------
# Species
# ---------------------------------------------------------------------------

class Species:
    """One ideal-gas species (immutable).

    Obtain one from a :class:`Database` (``db["N2"]``; the species keeps its
    database alive) or build one with :meth:`Species.from_constants`.
    Any number of threads may evaluate the same Species at once.

    Units: T in K, p in Pa (default ``P_STANDARD`` = 1e5 Pa), energies in
    J/mol, entropies and heat capacities in J/(mol K), their T-derivatives
    in J/(mol K^2).  Enthalpy scale: h(T) = dfH(298.15 K) + [H(T) -
    H(298.15 K)], with dfH = 0 for a species without a formation enthalpy.
    """

    def __init__(self, *args, **kwargs):
        raise TypeError("use Database[...] or Species.from_constants(...)")

    @classmethod
    def _wrap(cls, ptr, owner=None, owned=False):
        self = object.__new__(cls)
        self._db = owner
        self._h = _Handle(self, ptr, _L.molq_species_free if owned else None)
        return self

    # -- construction ------------------------------------------------------

    @classmethod
    def from_constants(cls, name, *, structure, molar_mass,
                       symmetry_number=1, rotational_constants=(),
                       vibrations=(), electronic_levels=(),
                       formation_enthalpy=None, formula=None,
                       rotor="corrected", source=None, model=None,
                       diatomic_states=None, dissociation_energy=None,
                       spin_isomers="equilibrium", odd_fraction=None):
        """Build a species from molecular constants.

        Args:
            name: species name (1..255 bytes of UTF-8).
            structure: ``"atom"``, ``"linear"`` or ``"nonlinear"``.
            molar_mass: molar mass in **g/mol** (as in species files, e.g.
                28.0134 for N2); converted to kg/mol for the C library.
                ``None`` computes it from ``formula`` (standard atomic
                weights).
            symmetry_number: rotational symmetry number (integer >= 1).
            rotational_constants: cm^-1; one value (B) for a linear
                molecule, three (A >= B >= C) for a nonlinear one.  A single
                number is accepted for a linear molecule.
            vibrations: harmonic modes, each a wavenumber in cm^-1 or a
                ``(wavenumber, degeneracy)`` pair.
            electronic_levels: each an energy above the ground level in
                cm^-1 or an ``(energy, degeneracy)`` pair; when given they
                replace the default non-degenerate ground level.
            formation_enthalpy: standard enthalpy of formation at 298.15 K,
                J/mol, or None.
            formula: chemical formula text, e.g. ``"CO2"``.
            rotor: ``"corrected"`` (rigid rotor with quantum corrections,
                the default) or ``"classical"`` (textbook high-T rotor).
            source: free-text citation of the data.
            model: ``"rrho"`` or ``"levels"`` (see :func:`model_names`);
                None: ``"levels"`` when diatomic_states are given, else
                ``"rrho"``.
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
                4).
            dissociation_energy: D0 of the ground state from its lowest
                level, cm^-1 (required by the levels model).
            spin_isomers: ``"equilibrium"`` (default) or ``"frozen"``: even-
                and odd-J molecules as a mixture of fixed composition, whose
                odd-J mole fraction is `odd_fraction` (0.75 for normal
                hydrogen).

        Raises:
            MolqError: the library rejected a value; the message names the
                species and field.
            ValueError, TypeError: a malformed Python argument.
        """
        bname = _encode_name(name, "name")
        try:
            struct_id = _STRUCTURES[structure]
        except (KeyError, TypeError):
            raise ValueError("structure must be one of %s, not %r"
                             % (", ".join(_STRUCTURES), structure)) from None
        try:
            rotor_id = _ROTORS[rotor]
        except (KeyError, TypeError):
            raise ValueError("rotor must be one of %s, not %r"
                             % (", ".join(_ROTORS), rotor)) from None
        model_id = None if model is None else _model_id(model)
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
        who = "species %r" % (name,)

        def check(status, field):
            if status != 0:
                _fail(status, None, "%s: field '%s'" % (who, field))

        spec = ctypes.c_void_p()
        check(_L.molq_spec_new(bname, ctypes.byref(spec)), "name")
        try:
            check(_L.molq_spec_set_structure(spec, struct_id), "structure")
            check(_L.molq_spec_set_rotor(spec, rotor_id), "rotor")
            check(_L.molq_spec_set_symmetry_number(
                spec, _as_int(symmetry_number, "symmetry_number")),
                "symmetry_number")
            if molar_mass is not None:
                check(_L.molq_spec_set_molar_mass(
                    spec, float(molar_mass) * 1e-3), "molar_mass")
            if formula is not None:
                check(_L.molq_spec_set_formula(
                    spec, _encode_name(formula, "formula")), "formula")
            if source is not None:
                check(_L.molq_spec_set_source(
                    spec, _encode_name(source, "source")), "source")
            if formation_enthalpy is not None:
                check(_L.molq_spec_set_formation_enthalpy(
                    spec, float(formation_enthalpy)), "formation_enthalpy")
            if _is_scalar(rotational_constants):
                rotational_constants = (rotational_constants,)
            rc = [float(b) for b in rotational_constants]
            if rc:
                arr = (ctypes.c_double * len(rc))(*rc)
                check(_L.molq_spec_set_rotational_constants(spec, arr,
                                                            len(rc)),
                      "rotational_constants")
            for i, (value, deg) in enumerate(_pairs(vibrations,
                                                    "vibrations")):
                check(_L.molq_spec_add_vibration(spec, value, deg),
                      "vibrations[%d]" % i)
            for i, (value, deg) in enumerate(_pairs(electronic_levels,
                                                    "electronic_levels")):
                check(_L.molq_spec_add_electronic_level(spec, value, deg),
                      "electronic_levels[%d]" % i)
            if model_id is not None:
                check(_L.molq_spec_set_model(spec, model_id), "model")
            if dissociation_energy is not None:
                check(_L.molq_spec_set_dissociation_energy(
                    spec, float(dissociation_energy)), "dissociation_energy")
            if spin_isomers == "frozen":
                check(_L.molq_spec_set_spin_isomers_frozen(
                    spec, float(odd_fraction)), "odd_fraction")
            for i, state in enumerate(diatomic_states):
                _add_diatomic_state(spec, i, state, check)
            out = ctypes.c_void_p()
            buf = _lib.errbuf()
            status = _L.molq_species_create(spec, ctypes.byref(out), buf,
                                            _lib.ERRLEN)
            if status != 0:
                _fail(status, buf, who)
        finally:
            _L.molq_spec_free(spec)
        return cls._wrap(out.value, owned=True)

    # -- lifetime ----------------------------------------------------------

    def close(self):
        """Release the species now (species made by from_constants are
        freed; a database species just lets go of its database).  Further
        use raises ValueError.  Also happens on garbage collection."""
        self._h.close()
        self._db = None

    def __enter__(self):
        return self

    def __exit__(self, *exc):
        self.close()

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
        return Species._wrap(out.value, owned=True)

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

    def _raise_eval(self, status, prop, T, p, per_mass=False):
        where = "species %r: %s%s at T=%r K, p=%r Pa" % (
            self.name, prop, " per mass" if per_mass else "", T, p)
        if status == 11:
            where += " (lowest valid T for this species: %r K)" % self.t_min
        _fail(status, None, where)

    def _scalar(self, fn, prop, pid, T, p, per_mass=False):
        T = float(T)
        out = ctypes.c_double()
        status = fn(self._ptr, T, p, pid, ctypes.byref(out))
        if status != 0:
            self._raise_eval(status, prop, T, p, per_mass)
        return out.value

    def _batch(self, ptr, prop, pid, p, tbuf, obuf, n, values):
        status = _L.molq_eval_batch(ptr, pid, p, tbuf, 1, obuf, 1, n)
        if status != 0:
            # Report the first offending temperature.
            for T in values:
                self._scalar(_L.molq_eval, prop, pid, T, p)
            self._raise_eval(status, prop, "(batch)", p)

    def eval(self, prop, T, p=P_STANDARD):
        """Evaluate property `prop` per mole at temperature(s) T and pressure
        p.

        Args:
            prop: a property name from :func:`molq.property_names`, e.g.
                ``"cp"`` (J/(mol K)), ``"h"`` (J/mol), ``"s"`` (J/(mol K)),
                ``"h_minus_h298"`` (J/mol), ``"lnq"`` (dimensionless).
            T: temperature in K: a number, any sequence or iterable of
                numbers, or a numpy array.
            p: pressure in Pa (one number; default 1e5 Pa).

        Returns:
            A float for a number, a list of floats for a sequence, a numpy
            float64 array of T's shape for a numpy array.

        Raises:
            ValueError: unknown property name.
            MolqError: T or p not finite and positive (``EDOMAIN``), or T
                below :attr:`t_min` (``ERANGE``).
        """
        pid = _prop_id(prop)
        p = _as_pressure(p)
        ptr = self._ptr
        if _is_scalar(T):
            return self._scalar(_L.molq_eval, prop, pid, T, p)
        ndarray = _numpy_array_type()
        if ndarray is not None and isinstance(T, ndarray):
            np = sys.modules["numpy"]
            tarr = np.ascontiguousarray(T, dtype=np.float64)
            out = np.empty(tarr.shape, dtype=np.float64)
            n = tarr.size
            if n:
                dp = ctypes.POINTER(ctypes.c_double)
                self._batch(ptr, prop, pid, p, tarr.ctypes.data_as(dp),
                            out.ctypes.data_as(dp), n, tarr.ravel())
            return out
        if isinstance(T, (str, bytes, bytearray)):
            raise TypeError("T must be a number or a sequence of numbers in "
                            "K, not %s" % type(T).__name__)
        values = [float(t) for t in T]
        n = len(values)
        if n == 0:
            return []
        tbuf = (ctypes.c_double * n)(*values)
        obuf = (ctypes.c_double * n)()
        self._batch(ptr, prop, pid, p, tbuf, obuf, n, values)
        return list(obuf)

    def eval_per_mass(self, prop, T, p=P_STANDARD):
        """As :meth:`eval`, per unit mass: extensive properties divided by
        the molar mass, giving J/(kg K), J/kg, J/(kg K^2); ``"lnq"`` and
        ``"dgRT_dT"`` are returned unchanged.  T may be a number, a
        sequence (returns a list) or a numpy array (returns an array)."""
        pid = _prop_id(prop)
        p = _as_pressure(p)
        fn = _L.molq_eval_per_mass
        if _is_scalar(T):
            return self._scalar(fn, prop, pid, T, p, per_mass=True)
        ndarray = _numpy_array_type()
        if ndarray is not None and isinstance(T, ndarray):
            np = sys.modules["numpy"]
            tarr = np.asarray(T, dtype=np.float64)
            out = np.empty(tarr.shape, dtype=np.float64)
            flat = out.reshape(-1)
            for i, t in enumerate(tarr.reshape(-1)):
                flat[i] = self._scalar(fn, prop, pid, t, p, per_mass=True)
            return out
        if isinstance(T, (str, bytes, bytearray)):
            raise TypeError("T must be a number or a sequence of numbers in "
                            "K, not %s" % type(T).__name__)
        return [self._scalar(fn, prop, pid, t, p, per_mass=True) for t in T]

    def eval_many(self, props, T, p=P_STANDARD):
        """Several properties at one state (T in K, p in Pa), summing the
        partition function once.  Returns a dict {name: value} in the order
        of `props` (units as in :meth:`eval`)."""
        props = list(props)
        ids = [_prop_id(name) for name in props]
        T = float(T)
        p = _as_pressure(p)
        n = len(ids)
        if n == 0:
            return {}
        idarr = (ctypes.c_int * n)(*ids)
        out = (ctypes.c_double * n)()
        status = _L.molq_eval_many(self._ptr, T, p, idarr, n, out)
        if status != 0:
            self._raise_eval(status, ",".join(props), T, p)
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

        if _is_scalar(T):
            return one(T)
        ndarray = _numpy_array_type()
        if ndarray is not None and isinstance(T, ndarray):
            np = sys.modules["numpy"]
            tarr = np.asarray(T, dtype=np.float64)
            res = np.empty(tarr.shape, dtype=np.float64)
            flat = res.reshape(-1)
            for i, t in enumerate(tarr.reshape(-1)):
                flat[i] = one(t)
            return res
        if isinstance(T, (str, bytes, bytearray)):
            raise TypeError("T must be a number or a sequence of numbers in "
                            "K, not %s" % type(T).__name__)
        return [one(t) for t in T]

    def modes(self, T, p=P_STANDARD):
        """Per-mode breakdown at one state (T in K, p in Pa).

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
        T = float(T)
        p = _as_pressure(p)
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


def _as_int(value, field):
    try:
        i = operator.index(value)
    except TypeError:
        raise TypeError("%s must be an integer, not %r" % (field, value)) \
            from None
    # Out-of-range values are left for the library to reject by name.
    return max(-_INT_CLAMP, min(_INT_CLAMP, i))


def _add_diatomic_state(spec, i, state, check):
    """Append diatomic_states[i] (a dict with the species-file keys)."""
    field = "diatomic_states[%d]" % i
    if not isinstance(state, collections.abc.Mapping):
        raise TypeError("%s must be a dict, not %s"
                        % (field, type(state).__name__))
    unknown = [k for k in state if k not in _STATE_KEYS]
    if unknown:
        raise ValueError("%s: unknown key %r (known: %s)"
                         % (field, unknown[0], ", ".join(_STATE_KEYS)))
    if "Te" not in state:
        raise ValueError("%s: 'Te' missing (0 for the ground state)" % field)
    label = state.get("label")
    if label is not None and not isinstance(label, str):
        raise TypeError("%s.label must be a str" % field)
    named = [k for k in _NAMED_CONSTANTS if k in state]
    if named and "dunham" in state:
        raise ValueError("%s: give either 'dunham' or the named constants "
                         "(%s), not both" % (field, ", ".join(named)))
    index = ctypes.c_size_t()
    check(_L.molq_spec_add_diatomic_state(
        spec, float(state["Te"]),
        _as_int(state.get("degeneracy", 1), field + ".degeneracy"),
        ctypes.byref(index)), field)
    idx = index.value
    for key in named:
        k, l, sign = _NAMED_CONSTANTS[key]
        check(_L.molq_spec_set_dunham(spec, idx, k, l,
                                      sign * float(state[key])),
              "%s.%s" % (field, key))
    if "dunham" in state:
        rows = state["dunham"]
        if _is_scalar(rows) or isinstance(rows, (str, bytes)) or \
                len(rows) > _DUNHAM_ROWS:
            raise ValueError("%s.dunham must be at most %d rows (powers of "
                             "v + 1/2) of at most %d numbers (powers of "
                             "J(J+1))" % (field, _DUNHAM_ROWS, _DUNHAM_COLS))
        for k, row in enumerate(rows):
            if _is_scalar(row) or isinstance(row, (str, bytes)) or \
                    len(row) > _DUNHAM_COLS:
                raise ValueError("%s.dunham[%d] must be a list of at most %d "
                                 "numbers" % (field, k, _DUNHAM_COLS))
            for l, y in enumerate(row):
                check(_L.molq_spec_set_dunham(spec, idx, k, l, float(y)),
                      "%s.dunham[%d][%d]" % (field, k, l))
    if "rotational_weights" in state:
        w = state["rotational_weights"]
        if _is_scalar(w) or isinstance(w, (str, bytes)) or len(w) != 2:
            raise ValueError("%s.rotational_weights must be [even-J weight, "
                             "odd-J weight]" % field)
        check(_L.molq_spec_set_rotational_weights(spec, idx, float(w[0]),
                                                  float(w[1])),
              field + ".rotational_weights")
    if "spin_orbit" in state:
        check(_L.molq_spec_set_spin_orbit(spec, idx,
                                          float(state["spin_orbit"])),
              field + ".spin_orbit")


def _pairs(items, field):
    """Yield (value, degeneracy) from numbers or (value, degeneracy) pairs."""
    if _is_scalar(items):
        items = (items,)
    for i, item in enumerate(items):
        if _is_scalar(item):
            yield float(item), 1
            continue
        try:
            value, deg = item
        except (TypeError, ValueError):
            raise TypeError("%s[%d] must be a number or a (value, degeneracy) "
                            "pair, not %r" % (field, i, item)) from None
        yield float(value), _as_int(deg, "%s[%d] degeneracy" % (field, i))


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

class Database:
    """An immutable set of species read from JSON (or the built-in starter
    set).  ``len(db)``, ``db.names()``, ``db["N2"]`` (KeyError for unknown
    names), ``"N2" in db`` and iteration (species in file order) work as
    for a mapping.  Species taken from a database keep it alive."""

    def __init__(self, *args, **kwargs):
        raise TypeError("use Database.builtin(), Database.from_file(path) or "
                        "Database.from_string(text)")

    @classmethod
    def _wrap(cls, ptr):
        self = object.__new__(cls)
        self._h = _Handle(self, ptr, _L.molq_db_free)
        return self

    @classmethod
    def builtin(cls):
        """The starter species set compiled into the library (Ar, O, H2,
        N2, O2, CO, CO2, H2O, each with its published source)."""
        out = ctypes.c_void_p()
        buf = _lib.errbuf()
        status = _L.molq_db_builtin(ctypes.byref(out), buf, _lib.ERRLEN)
        if status != 0:
            _fail(status, buf, "built-in species set")
        return cls._wrap(out.value)

    @classmethod
    def from_file(cls, path):
        """Read a species file (JSON, schema version 1; molar_mass in g/mol,
        constants in cm^-1, formation_enthalpy_298 in J/mol).

        Raises MolqError whose message gives the line and column of a syntax
        error, or the species and field of a bad value."""
        bpath = os.fsencode(path)
        out = ctypes.c_void_p()
        buf = _lib.errbuf()
        status = _L.molq_db_read_file(bpath, ctypes.byref(out), buf,
                                      _lib.ERRLEN)
        if status != 0:
            _fail(status, buf, "species file %r" % os.fsdecode(bpath))
        return cls._wrap(out.value)

    @classmethod
    def from_string(cls, text):
        """As :meth:`from_file`, from JSON text (str or UTF-8 bytes)."""
        data = text.encode("utf-8") if isinstance(text, str) else bytes(text)
        out = ctypes.c_void_p()
        buf = _lib.errbuf()
        status = _L.molq_db_read_string(data, len(data), ctypes.byref(out),
                                        buf, _lib.ERRLEN)
        if status != 0:
            _fail(status, buf, "species text")
        return cls._wrap(out.value)

    def close(self):
        """Free the database now.  Species taken from it become unusable
        (ValueError); without close() it lives as long as any of them."""
        self._h.close()

    def __enter__(self):
        return self

    def __exit__(self, *exc):
        self.close()

    @property
    def _ptr(self):
        if self._h.ptr is None:
            raise ValueError("molq.Database used after close()")
        return self._h.ptr

    def __len__(self):
        return _L.molq_db_count(self._ptr)

    def _at(self, index):
        ptr = _L.molq_db_species(self._ptr, index)
        if not ptr:
            raise IndexError(index)
        return Species._wrap(ptr, owner=self)

    def __iter__(self):
        for i in range(len(self)):
            yield self._at(i)

    def names(self):
        """Species names in file order."""
        db = self._ptr
        return [_decode(_L.molq_species_name(_L.molq_db_species(db, i)))
                for i in range(_L.molq_db_count(db))]

    def __getitem__(self, name):
        if not isinstance(name, (str, bytes)):
            raise KeyError(name)
        out = ctypes.c_void_p()
        status = _L.molq_db_find(self._ptr, _encode_name(name, "name"),
                                 ctypes.byref(out))
        if status == 9:
            raise KeyError(name)
        if status != 0:
            _fail(status, None, "species %r" % (name,))
        return Species._wrap(out.value, owner=self)

    def get(self, name, default=None):
        """``db[name]``, or `default` when there is no such species."""
        try:
            return self[name]
        except KeyError:
            return default

    def __contains__(self, name):
        return self.get(name) is not None

    def __repr__(self):
        if self._h.ptr is None:
            return "<molq.Database (closed)>"
        return "<molq.Database %d species: %s>" % (len(self),
                                                   ", ".join(self.names()))

