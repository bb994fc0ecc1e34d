"""molq -- ideal-gas thermodynamic properties from molecular constants.

A thin ctypes binding of the molq C library (libmolq.so), which computes
partition functions and the thermodynamic functions that follow from them
by statistical mechanics.  Standard library only; numpy is optional (numpy
arrays in, numpy arrays out).

Units
-----
T in K, p in Pa (default ``molq.P_STANDARD`` = 1e5 Pa), energies in J/mol,
entropies and heat capacities in J/(mol K), T-derivatives of heat capacity
in J/(mol K^2).  Molar mass is given and reported in **g/mol** (as in the
species files); rotational constants, vibrational wavenumbers and
electronic level energies in cm^-1.  ``h`` is on the scale
dfH(298.15 K) + [H(T) - H(298.15 K)]; ``s`` is at pressure p.

Main objects
------------
``molq.Database.builtin()`` / ``.from_file(path)`` / ``.from_string(text)``
    species sets; ``len(db)``, ``db.names()``, ``db["N2"]``, iteration.
``molq.Species.from_constants(name, structure=..., molar_mass=..., ...)``
    a species from your own constants (rigid rotor / harmonic, or a
    diatomic's electronic states for the level sum: ``diatomic_states=``,
    ``dissociation_energy=``, ``model=``; polyatomic level inputs:
    ``anharmonicity=``, ``torsions=``, ``rotational_weights=``,
    ``rotational_spin=``).
``sp.model``, ``sp.with_model("rrho")``, ``molq.model_names()``
    the model a species uses ("rrho": rigid rotor, harmonic vibrations,
    electronic level list; "levels": explicit level sums, for the bound
    ro-vibrational levels of a diatomic and for hindered internal rotors)
    and a copy of it with another model.
``sp.spin_conversion(T)``
    ortho-para conversion enthalpy h_frozen - h_equilibrium, J/mol
    (levels model).
``sp.eval(prop, T, p)`` and the shortcuts ``sp.cp``, ``cv``, ``h``, ``u``,
``s``, ``g``, ``a``, ``lnq``, ``gef``, ``h_minus_h298``, ``h_minus_h0``,
``dcp_dT``; ``sp.eval_per_mass``, ``sp.eval_many``, ``sp.modes(T, p)``.
    T and p may each be a number (float back), a sequence (list back) or
    a numpy array (array back); a number goes with every element of the
    other, two sequences pair up, numpy arrays broadcast.
``Species.from_dict(entry)``
    a species from one species-file entry (a dict with the file's keys).
Copying and pickling
    ``copy.deepcopy`` returns the (immutable) object itself; ``pickle``
    stores a species' description and rebuilds it, so species can be sent
    to multiprocessing pools.
``molq.UnknownSpeciesError``
    the KeyError of ``db[name]`` for an unknown name, suggesting near names
    (``"no species 'n2' ...; did you mean 'N2'?"``).
``molq.MolqError``
    raised for errors the library reports (``.status``, ``.status_name``,
    ``.message``); unknown property names raise ValueError.
``molq.property_names()``, ``molq.property_unit(name)``, ``molq.version()``.

The library is found through the environment variable MOLQ_LIBRARY (full
path to libmolq.so), else, for an installed copy of the package, the
library installed with it (path recorded in ``molq/_config.py``) or, in a
source checkout, a build tree of this checkout (``build*/lib``), else the
system's library path.  Species objects may be evaluated from any
number of threads at once.

Example
-------
The exhaust of an (invented) timber-drying oven, 0.40 kg/s of moist air
with some flue gas, is cooled from 430 K to 340 K in a heat-recovery coil.
How much heat does the coil take up, and what is the exhaust's mean cp?
An added tracer gas "Xd" (a made-up diatomic) is described by its
constants::

    import molq

    db = molq.Database.builtin()
    exhaust = {"N2": 0.74, "O2": 0.15, "H2O": 0.09, "CO2": 0.02}  # mole fr.
    m_dot = 0.40                     # kg/s
    T_in, T_out = 430.0, 340.0       # K

    M_mix = sum(x * db[n].molar_mass for n, x in exhaust.items())  # g/mol
    n_dot = m_dot / (M_mix * 1e-3)                                  # mol/s
    dh = sum(x * (db[n].h(T_in) - db[n].h(T_out))
             for n, x in exhaust.items())                           # J/mol
    duty_kW = n_dot * dh / 1e3
    cp_mean = dh / (T_in - T_out)                                   # J/(mol K)
    print(f"coil duty {duty_kW:.1f} kW, mean cp {cp_mean:.2f} J/(mol K)")

    # cp of the water vapour along the coil, several temperatures at once
    temps = [340.0, 370.0, 400.0, 430.0]
    print(dict(zip(temps, db["H2O"].cp(temps))))

    # N2 uses the diatomic level sum; its rigid-rotor / harmonic variant
    # for comparison, and the models the library offers
    n2 = db["N2"]
    print(n2.model, n2.cp(T_in), n2.with_model("rrho").cp(T_in))
    print(molq.model_names())

    # an invented diatomic tracer from its constants (molar mass in g/mol)
    xd = molq.Species.from_constants(
        "Xd", structure="linear", molar_mass=45.0, symmetry_number=1,
        rotational_constants=[0.85], vibrations=[(1150.0, 1)],
        electronic_levels=[(0.0, 2)])
    for mode in xd.modes(T_in):
        print(mode["kind"], round(mode["cv"], 3), "J/(mol K)")

    try:
        xd.cp(-5.0)
    except molq.MolqError as exc:
        print("rejected:", exc.status_name, exc.message)

CAUTION: molq computes ideal-gas estimates.  They are not a basis for the
design of pressure equipment, burners or safety systems without
verification under the applicable codes and licensed engineering review.
"""

from ._core import (  # noqa: F401  (re-exported API)
    P_STANDARD,
    T_REF,
    STATUS_NAMES,
    MolqError,
    Database,
    UnknownSpeciesError,
    Species,
    model_names,
    property_names,
    property_unit,
    status_string,
    version,
    library_path,
)
from ._core import (  # noqa: F401  status codes: molq.EVALUE == 7, ...
    EARG, ENOMEM, EIO, ESYNTAX, EKEY, ETYPE, EVALUE, EDUPLICATE, ENOTFOUND,
    EDOMAIN, ERANGE, ELIMIT,
)

__version__ = "0.1.0"

__all__ = [
    "P_STANDARD", "T_REF", "STATUS_NAMES", "MolqError", "Database",
    "UnknownSpeciesError",
    "Species", "model_names", "property_names", "property_unit", "status_string",
    "version", "library_path",
    "EARG", "ENOMEM", "EIO", "ESYNTAX", "EKEY", "ETYPE", "EVALUE",
    "EDUPLICATE", "ENOTFOUND", "EDOMAIN", "ERANGE", "ELIMIT",
]
