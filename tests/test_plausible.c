/* Plausibility checks of diatomic constants and of rotational constants
 * against a geometry (lib/data/plausible.c): each
 * relation warns on an invented-but-realistic bad entry and stays quiet on
 * a good one.  The good entry is CO X 1Sigma+ with Huber & Herzberg (1979)
 * constants as in data/species/diatomics.json (we, wexe, alpha_e from
 * memory; Be verified, NIST CCCBDB); D0 89594 cm^-1 from the JANAF 1998
 * formation enthalpies of C, O and CO (as that file says).  The relations:
 * Kratzer De = 4 Be^3/we^2, Pekeris alpha_e = 6 sqrt(wexe Be^3)/we -
 * 6 Be^2/we, Birge-Sponer well depth we^2/(4 wexe) (common practice;
 * Herzberg, Spectra of Diatomic Molecules, 1950, from memory). */
#include <stdio.h>
#include <string.h>

#include "testutil.h"

static const char *co_fmt =
    "{\"schema_version\": 1, \"species\": [{\"name\": \"COx\", "
    "\"formula\": \"CO\", \"structure\": \"linear\", "
    "\"dissociation_energy\": %g, \"diatomic_states\": [{\"Te\": 0, "
    "\"degeneracy\": 1, \"we\": 2169.81358, \"wexe\": %g, \"Be\": "
    "1.93128087, \"alpha_e\": %g, \"De\": %g}]}]}";

/* Load a CO-like species with the given D0, wexe, alpha_e and De; return
 * its warning count and copy warning 0 into w0. */
static size_t co_warnings(double d0, double wexe, double alpha, double de,
                          char *w0, size_t w0len)
{
    char js[1024];
    molq_db *db = NULL;
    const molq_species *sp;
    size_t n;
    snprintf(js, sizeof js, co_fmt, d0, wexe, alpha, de);
    sp = tu_from_json(js, &db);
    n = molq_species_warning_count(sp);
    ck_assert_uint_eq(molq_db_warning_count(db), n);
    w0[0] = '\0';
    if (n > 0)
        snprintf(w0, w0len, "%s", molq_species_warning(sp, 0));
    molq_db_free(db);
    return n;
}

START_TEST(good_entry_is_quiet)
{
    char w[512];
    ck_assert_msg(co_warnings(89594, 13.28831, 0.01750441, 6.1215e-6, w,
                              sizeof w) == 0, "%s", w);
}
END_TEST

/* De typed with the wrong power of ten (6.1215e-7) */
START_TEST(kratzer_flags_de)
{
    char w[512];
    ck_assert_uint_eq(co_warnings(89594, 13.28831, 0.01750441, 6.1215e-7, w,
                                  sizeof w), 1);
    ck_assert_msg(strstr(w, "species 'COx': field 'diatomic_states[0].De': "
                            "6.12e-07 cm^-1 is 0.1 x the Kratzer estimate") &&
                      strstr(w, "expected within 0.8-1.25"), "%s", w);
    /* a sign slip (De entered as the Dunham Y02 = -De) */
    ck_assert_uint_eq(co_warnings(89594, 13.28831, 0.01750441, -6.1215e-6, w,
                                  sizeof w), 1);
    ck_assert_ptr_nonnull(strstr(w, "'diatomic_states[0].De'"));
    /* 20 % off stays within the band */
    ck_assert_uint_eq(co_warnings(89594, 13.28831, 0.01750441, 7.3e-6, w,
                                  sizeof w), 0);
}
END_TEST

/* alpha_e three times too large (0.0525) */
START_TEST(pekeris_flags_alpha)
{
    char w[512];
    ck_assert_uint_eq(co_warnings(89594, 13.28831, 0.0525, 6.1215e-6, w,
                                  sizeof w), 1);
    ck_assert_msg(strstr(w, "field 'diatomic_states[0].alpha_e': 0.0525 "
                            "cm^-1 is 3.1 x the Pekeris estimate") &&
                      strstr(w, "expected within 0.6-1.7"), "%s", w);
}
END_TEST

/* D0 in the wrong unit-sized slip: 35000 instead of 89594 cm^-1 makes the
 * ladder turn over at 2.5 x the well depth */
START_TEST(turnover_flags_d0)
{
    char w[512];
    ck_assert_uint_eq(co_warnings(35000, 13.28831, 0.01750441, 6.1215e-6, w,
                                  sizeof w), 1);
    ck_assert_msg(strstr(w, "field 'diatomic_states[0].wexe': the vibrational "
                            "ladder turns over at we^2/(4 wexe) = 8.858e+04 "
                            "cm^-1, 2.5 x the well depth") &&
                      strstr(w, "expected within 0.7-1.8"), "%s", w);
}
END_TEST

/* The same checks read Dunham coefficients: Y02 = -De with De ten times
 * too large warns, the right one does not */
START_TEST(dunham_input)
{
    static const char fmt[] =
        "{\"schema_version\": 1, \"species\": [{\"name\": \"COd\", "
        "\"formula\": \"CO\", \"structure\": \"linear\", "
        "\"dissociation_energy\": 89594, \"diatomic_states\": [{\"Te\": 0, "
        "\"degeneracy\": 1, \"dunham\": [[0, 1.93128087, %g], "
        "[2169.81358, -0.01750441], [-13.28831]]}]}]}";
    char js[1024];
    molq_db *db = NULL;
    const molq_species *sp;
    snprintf(js, sizeof js, fmt, -6.1215e-5);
    sp = tu_from_json(js, &db);
    ck_assert_uint_eq(molq_species_warning_count(sp), 1);
    ck_assert_msg(strstr(molq_species_warning(sp, 0),
                         "'diatomic_states[0].De': 6.12e-05 cm^-1 is 10 x"),
                  "%s", molq_species_warning(sp, 0));
    molq_db_free(db);
    snprintf(js, sizeof js, fmt, -6.1215e-6);
    sp = tu_from_json(js, &db);
    ck_assert_uint_eq(molq_species_warning_count(sp), 0);
    molq_db_free(db);
}
END_TEST

/* Be against re and the reduced mass: CO re 1.128323 Angstrom (Huber &
 * Herzberg 1979, from memory) gives Be 1.9301 cm^-1 with standard atomic
 * weights, 0.06 % from the Be given: quiet.  re 1.20 Angstrom (an invented
 * slip) puts the geometric Be 11.6 % lower: warned.  A negative re is an
 * error naming the field. */
START_TEST(be_against_re)
{
    static const char fmt[] =
        "{\"schema_version\": 1, \"species\": [{\"name\": \"COr\", "
        "\"formula\": \"CO\", \"structure\": \"linear\", "
        "\"dissociation_energy\": 89594, \"diatomic_states\": [{\"Te\": 0, "
        "\"degeneracy\": 1, \"we\": 2169.81358, \"wexe\": 13.28831, "
        "\"Be\": 1.93128087, \"alpha_e\": 0.01750441, \"De\": 6.1215e-6, "
        "\"re\": %g}]}]}";
    char js[1024], err[512];
    molq_db *db = NULL;
    const molq_species *sp;
    snprintf(js, sizeof js, fmt, 1.128323);
    sp = tu_from_json(js, &db);
    ck_assert_msg(molq_species_warning_count(sp) == 0, "%s",
                  molq_species_warning(sp, 0));
    molq_db_free(db);
    snprintf(js, sizeof js, fmt, 1.20);
    sp = tu_from_json(js, &db);
    ck_assert_uint_eq(molq_species_warning_count(sp), 1);
    ck_assert_msg(strstr(molq_species_warning(sp, 0),
                         "field 'diatomic_states[0].Be': 1.93128 cm^-1 "
                         "differs by 13 % from h/(8 pi^2 c mu re^2) = 1.70") &&
                      strstr(molq_species_warning(sp, 0),
                             "expected within 2 %"),
                  "%s", molq_species_warning(sp, 0));
    molq_db_free(db);
    snprintf(js, sizeof js, fmt, -1.0);
    db = NULL;
    ck_assert_int_eq(molq_db_read_string(js, strlen(js), &db, err, sizeof err),
                     MOLQ_EVALUE);
    ck_assert_msg(strstr(err, "field 'diatomic_states[0].re': must be"), "%s",
                  err);
    ck_assert_ptr_null(db);
}
END_TEST

/* D0 against the formation enthalpies through AB -> A + B.  Atoms N (4S,
 * g 4) and O (3P2,1,0 at 0, 158.265, 226.977 cm^-1; NIST ASD, from memory)
 * with JANAF 1998 formation enthalpies 472.68 and 249.18 kJ/mol, NO 90.29
 * kJ/mol (from memory) treated as one state of degeneracy 4 with the
 * Huber & Herzberg constants of data/species/diatomics.json: D0 52400
 * cm^-1 (Huber & Herzberg, from memory) agrees within 0.2 %; the well
 * depth De = D0 + G(0) = 53348 cm^-1 typed for D0 (an invented slip) is
 * 1.8 % off and warned.  Without the atoms in the file nothing is
 * checked.  The measurement on the built-in set (within 0.16 %) is in the
 * comment of lib/api/db.c. */
static const char d0_fmt[] =
    "{\"schema_version\": 1, \"species\": [%s"
    "{\"name\": \"NOx\", \"formula\": \"NO\", \"structure\": \"linear\", "
    "\"formation_enthalpy_298\": 90290, \"dissociation_energy\": %g, "
    "\"diatomic_states\": [{\"Te\": 0, \"degeneracy\": 4, \"we\": 1904.2, "
    "\"wexe\": 14.075, \"Be\": 1.70493, \"alpha_e\": 0.0171, "
    "\"De\": 5.4e-6}]}]}";
static const char d0_atoms[] =
    "{\"name\": \"N\", \"formula\": \"N\", \"structure\": \"atom\", "
    "\"formation_enthalpy_298\": 472680, \"electronic_levels\": "
    "[{\"energy\": 0, \"degeneracy\": 4}]}, "
    "{\"name\": \"O\", \"formula\": \"O\", \"structure\": \"atom\", "
    "\"formation_enthalpy_298\": 249180, \"electronic_levels\": "
    "[{\"energy\": 0, \"degeneracy\": 5}, {\"energy\": 158.265, "
    "\"degeneracy\": 3}, {\"energy\": 226.977, \"degeneracy\": 1}]}, ";

START_TEST(d0_against_enthalpies)
{
    char js[2048];
    molq_db *db = NULL;
    const molq_species *no;
    snprintf(js, sizeof js, d0_fmt, d0_atoms, 52400.0);
    tu_from_json(js, &db);
    ck_assert_msg(molq_db_warning_count(db) == 0, "%s",
                  molq_db_warning(db, 0));
    molq_db_free(db);
    snprintf(js, sizeof js, d0_fmt, d0_atoms, 53348.0);
    tu_from_json(js, &db);
    ck_assert_int_eq(molq_db_find(db, "NOx", &no), MOLQ_OK);
    ck_assert_uint_eq(molq_species_warning_count(no), 1);
    ck_assert_uint_eq(molq_db_warning_count(db), 1);
    ck_assert_str_eq(molq_db_warning(db, 0), molq_species_warning(no, 0));
    ck_assert_msg(strstr(molq_species_warning(no, 0),
                         "species 'NOx': field 'dissociation_energy': 53348 "
                         "cm^-1 = 638.2 kJ/mol differs by -10.") &&
                      strstr(molq_species_warning(no, 0),
                             "'N', 'O' and 'NOx'"),
                  "%s", molq_species_warning(no, 0));
    molq_db_free(db);
    /* no atoms: no check */
    snprintf(js, sizeof js, d0_fmt, "", 53348.0);
    tu_from_json(js, &db);
    ck_assert_uint_eq(molq_db_warning_count(db), 0);
    molq_db_free(db);
}
END_TEST

/* D0 of an ion against the formation enthalpies.  NO+ has two limits, N + O+
 * and N+ + O; the lower (N + O+, by the difference of the atoms' ionisation
 * energies, 0.92 eV) bounds the ground state's levels.  Formation enthalpies
 * on NIST-JANAF 1998's ion convention (the electron gas a reference
 * element): N+ 1882.130, O+ 1568.786, NO+ 990.185 kJ/mol (verified: the
 * JANAF extracts in tests/data/janaf/); N and O as above; NO+ X 1Sigma+
 * we 2376.42, wexe 16.262, Be 1.99727, alpha_e 0.01889, De 5.64e-6 cm^-1
 * (Huber & Herzberg 1979, from memory).  They give D0 = 1047.4 kJ/mol =
 * 87556 cm^-1 (Huber & Herzberg: 10.85 eV = 87510 cm^-1, from memory);
 * the N+ + O limit, 95050 cm^-1, typed for it is warned and the message
 * names the lower limit's atoms.  Before the ion check every charged
 * diatomic was skipped, so the slip passed unnoticed (this test failed
 * there).  With only the neutral atoms in the file nothing is checked. */
static const char d0_ion_fmt[] =
    "{\"schema_version\": 1, \"species\": [%s"
    "{\"name\": \"NOp\", \"formula\": \"NO+\", \"structure\": \"linear\", "
    "\"formation_enthalpy_298\": 990185, \"dissociation_energy\": %g, "
    "\"diatomic_states\": [{\"Te\": 0, \"degeneracy\": 1, \"we\": 2376.42, "
    "\"wexe\": 16.262, \"Be\": 1.99727, \"alpha_e\": 0.01889, "
    "\"De\": 5.64e-6}]}]}";
static const char d0_ions[] =
    "{\"name\": \"N+\", \"formula\": \"N+\", \"structure\": \"atom\", "
    "\"formation_enthalpy_298\": 1882130, \"electronic_levels\": "
    "[{\"energy\": 0, \"degeneracy\": 1}, {\"energy\": 48.67, "
    "\"degeneracy\": 3}, {\"energy\": 130.8, \"degeneracy\": 5}]}, "
    "{\"name\": \"O+\", \"formula\": \"O+\", \"structure\": \"atom\", "
    "\"formation_enthalpy_298\": 1568786, \"electronic_levels\": "
    "[{\"energy\": 0, \"degeneracy\": 4}]}, ";

START_TEST(d0_ion_against_enthalpies)
{
    char atoms[2048], js[4096];
    molq_db *db = NULL;
    const molq_species *ion;
    snprintf(atoms, sizeof atoms, "%s%s", d0_atoms, d0_ions);
    snprintf(js, sizeof js, d0_ion_fmt, atoms, 87556.0);
    tu_from_json(js, &db);
    ck_assert_msg(molq_db_warning_count(db) == 0, "%s",
                  molq_db_warning(db, 0));
    molq_db_free(db);
    snprintf(js, sizeof js, d0_ion_fmt, atoms, 95050.0);
    tu_from_json(js, &db);
    ck_assert_int_eq(molq_db_find(db, "NOp", &ion), MOLQ_OK);
    ck_assert_uint_eq(molq_species_warning_count(ion), 1);
    ck_assert_msg(strstr(molq_species_warning(ion, 0),
                         "species 'NOp': field 'dissociation_energy': "
                         "95050 cm^-1") &&
                      strstr(molq_species_warning(ion, 0),
                             "'N', 'O+' and 'NOp'"),
                  "%s", molq_species_warning(ion, 0));
    molq_db_free(db);
    /* neutral atoms only: the ion's limits are not in the file */
    snprintf(js, sizeof js, d0_ion_fmt, d0_atoms, 95050.0);
    tu_from_json(js, &db);
    ck_assert_uint_eq(molq_db_warning_count(db), 0);
    molq_db_free(db);
}
END_TEST

/* The built-in set passes every check.  The proof on real data: the NO
 * entry carried De = 0.54e-6 cm^-1 until it was fixed, a tenth of its
 * Kratzer estimate 4 Be^3/we^2 = 5.47e-6 cm^-1 (we 1904.20, Be 1.70493,
 * the built-in values, Huber & Herzberg 1979 from memory); that old value
 * is flagged, the fixed one 5.4e-6 is not. */
START_TEST(builtin_set)
{
    const molq_db *db = tu_builtin();
    size_t i, j;
    static const char old_no[] =
        "{\"schema_version\": 1, \"species\": [{\"name\": \"NO\", "
        "\"formula\": \"NO\", \"structure\": \"linear\", "
        "\"dissociation_energy\": 52400, \"diatomic_states\": [{\"Te\": 0, "
        "\"degeneracy\": 4, \"spin_orbit\": 123.1, \"we\": 1904.20, "
        "\"wexe\": 14.075, \"Be\": 1.70493, \"alpha_e\": 0.0171, "
        "\"De\": %s}]}]}";
    char js[1024];
    molq_db *odb;
    for (i = 0; i < molq_db_count(db); i++) {
        const molq_species *sp = molq_db_species(db, i);
        for (j = 0; j < molq_species_warning_count(sp); j++)
            ck_abort_msg("unexpected warning: %s",
                         molq_species_warning(sp, j));
    }
    snprintf(js, sizeof js, old_no, "0.54e-6");
    tu_from_json(js, &odb);
    ck_assert_uint_eq(molq_db_warning_count(odb), 1);
    ck_assert_ptr_nonnull(strstr(molq_db_warning(odb, 0),
                                 "field 'diatomic_states[0].De'"));
    ck_assert_ptr_nonnull(strstr(molq_db_warning(odb, 0), "Kratzer"));
    molq_db_free(odb);
    snprintf(js, sizeof js, old_no, "5.4e-6");
    tu_from_json(js, &odb);
    ck_assert_uint_eq(molq_db_warning_count(odb), 0);
    molq_db_free(odb);
}
END_TEST

/* ---- rotational constants against a geometry (data/plausible.c, 5) ----
 *
 * Masses of the main isotopes, AME 2020 (Wang et al. 2021; from memory):
 * 1H 1.00782503223 u, 16O 15.99491461957 u (12C, 12 u, sits at the
 * centre of mass of CO2 and adds nothing); the atomic mass
 * constant 1.66053906660e-27 kg (CODATA 2018).  B = h / (8 pi^2 c I). */
#define G_MH 1.00782503223
#define G_MO 15.99491461957
#define G_MU 1.66053906660e-27
/* cm^-1 for I in amu Angstrom^2 */
#define G_BI (T_H / (8.0 * T_PI * T_PI * T_C * G_MU * 1e-20) / 100.0)

/* H2O entry text: O at p[0], H at p[1], p[2] (Angstrom), constants a, b,
 * c; extra is spliced in before the closing brace. */
static void h2o_json(char *js, size_t len, double p[3][3], double a,
                     double b, double c, const char *extra)
{
    snprintf(js, len,
             "{\"schema_version\": 1, \"species\": [{\"name\": \"W\", "
             "\"formula\": \"H2O\", \"structure\": \"nonlinear\", "
             "\"symmetry_number\": 2, \"rotational_constants\": [%.17g, "
             "%.17g, %.17g], \"vibrations\": [{\"wavenumber\": 3657}, "
             "{\"wavenumber\": 1595}, {\"wavenumber\": 3756}], "
             "\"geometry\": [{\"element\": \"O\", \"xyz\": [%.17g, %.17g, "
             "%.17g]}, {\"element\": \"H\", \"xyz\": [%.17g, %.17g, %.17g]}, "
             "{\"element\": \"H\", \"xyz\": [%.17g, %.17g, %.17g]}]%s}]}",
             a, b, c, p[0][0], p[0][1], p[0][2], p[1][0], p[1][1], p[1][2],
             p[2][0], p[2][1], p[2][2], extra);
}

/* The published equilibrium geometry of water, re(OH) 0.958 A, angle HOH
 * 104.4776 deg (Hoy & Bunker 1979, as tabulated by NIST CCCBDB; verified
 * this session), in the molecular plane with the C2 axis along y, then
 * turned by an arbitrary rotation and shifted: the library must find the
 * same centre of mass and principal axes in any frame. */
static void h2o_geometry(double p[3][3], int turn)
{
    const double r = 0.958, half = 0.5 * 104.4776 * T_PI / 180.0;
    double q[3][3] = {{0.0, 0.0, 0.0},
                      {r * sin(half), r * cos(half), 0.0},
                      {-r * sin(half), r * cos(half), 0.0}};
    /* rotation: 40 deg about z, then 25 deg about x; shift (1.5, -2, 3) */
    const double cz = cos(40.0 * T_PI / 180), sz = sin(40.0 * T_PI / 180);
    const double cx = cos(25.0 * T_PI / 180), sx = sin(25.0 * T_PI / 180);
    size_t i;
    for (i = 0; i < 3; i++) {
        double x = q[i][0], y = q[i][1], z = q[i][2];
        double x1 = cz * x - sz * y, y1 = sz * x + cz * y, z1 = z;
        if (!turn) {
            p[i][0] = x;
            p[i][1] = y;
            p[i][2] = z;
            continue;
        }
        p[i][0] = x1 + 1.5;
        p[i][1] = cx * y1 - sx * z1 - 2.0;
        p[i][2] = sx * y1 + cx * z1 + 3.0;
    }
}

/* The geometric constant printed in a warning ("... from X cm^-1 computed
 * from 'geometry'"). */
static double warned_value(const char *w)
{
    const char *p = strstr(w, "cm^-1 computed from 'geometry'");
    const char *q;
    double v = 0.0;
    ck_assert_msg(p != NULL, "%s", w);
    for (q = p; q > w && strncmp(q, " from ", 6) != 0; q--)
        ;
    ck_assert_int_eq(sscanf(q, " from %lf", &v), 1);
    return v;
}

/* A hand calculation for a bent XY2 molecule (common practice): with the
 * C2 axis along y, I_y = 2 m (r sin(t/2))^2, I_x = 2 m (r cos(t/2))^2 M /
 * (M + 2m) about the centre of mass, I_z = I_x + I_y (planar).  For
 * water I_x < I_y, so A = B(I_x), B = B(I_y), C = B(I_z): 27.363,
 * 14.580, 9.512 cm^-1.  The library's values, read from its warnings
 * for constants set far off (100, 50, 1), match them in either frame to
 * 5e-6 (the warning prints 6 digits; standard atomic weights instead of
 * the isotopes' would be about 2e-4 off); the published ground-state
 * constants A 27.877, B 14.512, C 9.285 cm^-1 (Herzberg 1966 as
 * tabulated by NIST CCCBDB; verified) lie within 2.4 % (vibrational
 * averaging and the inertial defect) and load
 * without a warning. */
START_TEST(geometry_h2o_hand_calculation)
{
    const double r = 0.958, half = 0.5 * 104.4776 * T_PI / 180.0;
    double iy = 2.0 * G_MH * pow(r * sin(half), 2);
    double ix = 2.0 * G_MH * pow(r * cos(half), 2) * G_MO /
                (G_MO + 2.0 * G_MH);
    double hand[3] = {G_BI / ix, G_BI / iy, G_BI / (ix + iy)};
    const double pub[3] = {27.877, 14.512, 9.285};
    double p[3][3];
    char js[2048];
    molq_db *db;
    const molq_species *sp;
    int turn;
    size_t k;
    ck_assert_msg(fabs(hand[0] - 27.363) < 0.001 &&
                      fabs(hand[1] - 14.580) < 0.001 &&
                      fabs(hand[2] - 9.512) < 0.001,
                  "%g %g %g", hand[0], hand[1], hand[2]);
    for (turn = 0; turn < 2; turn++) {
        h2o_geometry(p, turn);
        h2o_json(js, sizeof js, p, 100.0, 50.0, 1.0, "");
        sp = tu_from_json(js, &db);
        ck_assert_uint_eq(molq_species_warning_count(sp), 3);
        for (k = 0; k < 3; k++) {
            const char *w = molq_species_warning(sp, k);
            char field[64];
            snprintf(field, sizeof field, "species 'W': field "
                     "'rotational_constants[%zu]': %c = ", k, "ABC"[k]);
            ck_assert_msg(strstr(w, field) == w, "%s", w);
            ck_assert_close(warned_value(w), hand[k], 5e-6, 0.0);
        }
        molq_db_free(db);
        h2o_json(js, sizeof js, p, pub[0], pub[1], pub[2], "");
        sp = tu_from_json(js, &db);
        ck_assert_msg(molq_species_warning_count(sp) == 0, "%s",
                      molq_species_warning(sp, 0));
        molq_db_free(db);
    }
    for (k = 0; k < 3; k++)
        ck_assert_msg(fabs(pub[k] - hand[k]) < 0.024 * hand[k], "%zu", k);
}
END_TEST

/* CO2 with re(CO) 1.1600 A (from memory) gives Be 0.3916 cm^-1, 0.4 %
 * from B0 0.39022 (from memory, as data/species/polyatomics.json): quiet.
 * Both bonds typed 10 % long (1.276 A) put the geometric B 17 % lower,
 * the given B 21 % above it: warned, naming the field and the band.  One
 * bond 10 % long breaks the centre of symmetry as well, so the symmetry
 * number 2 is warned too; with 1 it is not. */
static size_t co2_warnings(double r1, double r2, int sigma, char *w,
                           size_t wlen)
{
    char js[1024];
    molq_db *db;
    const molq_species *sp;
    size_t n, i;
    snprintf(js, sizeof js,
             "{\"schema_version\": 1, \"species\": [{\"name\": \"D\", "
             "\"formula\": \"CO2\", \"structure\": \"linear\", "
             "\"symmetry_number\": %d, \"rotational_constants\": [0.39022], "
             "\"geometry\": [{\"element\": \"O\", \"xyz\": [0, 0, %.17g]}, "
             "{\"element\": \"C\", \"xyz\": [0, 0, 0]}, {\"element\": \"O\", "
             "\"xyz\": [0, 0, %.17g]}]}]}", sigma, -r1, r2);
    sp = tu_from_json(js, &db);
    n = molq_species_warning_count(sp);
    w[0] = '\0';
    for (i = 0; i < n; i++) /* all warnings, one a line */
        snprintf(w + strlen(w), wlen - strlen(w), "%s\n",
                 molq_species_warning(sp, i));
    molq_db_free(db);
    return n;
}

START_TEST(geometry_co2_bond_too_long)
{
    char w[2048];
    double bgeo = G_BI / (2.0 * G_MO * 1.16 * 1.16);
    ck_assert_close(bgeo, 0.39162, 1e-4, 0.0);
    ck_assert_msg(co2_warnings(1.16, 1.16, 2, w, sizeof w) == 0, "%s", w);
    ck_assert_uint_eq(co2_warnings(1.276, 1.276, 2, w, sizeof w), 1);
    ck_assert_msg(strstr(w, "species 'D': field 'rotational_constants[0]': "
                            "B = 0.39022 cm^-1 differs by +21 % from "
                            "0.32365") &&
                      strstr(w, "expected within 4 %"),
                  "%s", w);
    /* one bond long: B about 10 % off, and no centre of symmetry */
    ck_assert_uint_eq(co2_warnings(1.16, 1.276, 2, w, sizeof w), 2);
    ck_assert_msg(strstr(w, "species 'D': field 'symmetry_number': 2, but "
                            "the geometry is not centrosymmetric, so the "
                            "linear molecule's symmetry number is 1"),
                  "%s", w);
    ck_assert_ptr_nonnull(strstr(w, "field 'rotational_constants[0]'"));
    ck_assert_uint_eq(co2_warnings(1.16, 1.276, 1, w, sizeof w), 1);
    ck_assert_ptr_null(strstr(w, "symmetry_number"));
    /* a centrosymmetric one with symmetry number 1 */
    ck_assert_uint_eq(co2_warnings(1.16, 1.16, 1, w, sizeof w), 1);
    ck_assert_ptr_nonnull(strstr(w, "field 'symmetry_number': 1, but the "
                                    "geometry is centrosymmetric"));
    /* 3 % off (both bonds 1.5 % long) stays within the band */
    ck_assert_uint_eq(co2_warnings(1.1774, 1.1774, 2, w, sizeof w), 0);
}
END_TEST

/* A bent geometry for a linear structure and a straight one for a
 * nonlinear structure are warned on 'geometry'. */
START_TEST(geometry_shape)
{
    char js[1024];
    molq_db *db;
    const molq_species *sp;
    double p[3][3];
    /* CO2 bent by 10 deg */
    snprintf(js, sizeof js,
             "{\"schema_version\": 1, \"species\": [{\"name\": \"D\", "
             "\"formula\": \"CO2\", \"structure\": \"linear\", "
             "\"symmetry_number\": 2, \"rotational_constants\": [0.39022], "
             "\"geometry\": [{\"element\": \"O\", \"xyz\": [-1.1556, 0.1011, "
             "0]}, {\"element\": \"C\", \"xyz\": [0, 0, 0]}, {\"element\": "
             "\"O\", \"xyz\": [1.1556, 0.1011, 0]}]}]}");
    sp = tu_from_json(js, &db);
    ck_assert_uint_eq(molq_species_warning_count(sp), 1);
    ck_assert_msg(strstr(molq_species_warning(sp, 0),
                         "species 'D': field 'geometry': the atoms are not "
                         "collinear") &&
                      strstr(molq_species_warning(sp, 0),
                             "but 'structure' is linear"),
                  "%s", molq_species_warning(sp, 0));
    molq_db_free(db);
    /* water straightened */
    p[0][0] = p[0][1] = p[0][2] = 0.0;
    p[1][0] = 0.958;
    p[2][0] = -0.958;
    p[1][1] = p[1][2] = p[2][1] = p[2][2] = 0.0;
    h2o_json(js, sizeof js, p, 27.877, 14.512, 9.285, "");
    sp = tu_from_json(js, &db);
    ck_assert_uint_eq(molq_species_warning_count(sp), 1);
    ck_assert_msg(strstr(molq_species_warning(sp, 0),
                         "species 'W': field 'geometry': the atoms are "
                         "collinear") != NULL,
                  "%s", molq_species_warning(sp, 0));
    molq_db_free(db);
}
END_TEST

/* Input errors name the field, return the right code and build nothing. */
static void geometry_error(const char *geom, const char *formula,
                           const char *structure, molq_status code,
                           const char *want)
{
    char js[16384], err[512];
    molq_db *db = NULL;
    snprintf(js, sizeof js,
             "{\"schema_version\": 1, \"species\": [{\"name\": \"G\", "
             "%s%s%s \"structure\": \"%s\", \"symmetry_number\": %d, "
             "\"rotational_constants\": %s, \"geometry\": %s}]}",
             formula ? "\"formula\": \"" : "\"molar_mass\": 18.015",
             formula ? formula : "", formula ? "\"," : ",", structure,
             strcmp(structure, "atom") == 0 ? 1 : 2,
             strcmp(structure, "atom") == 0 ? "[]"
                                            : "[27.877, 14.512, 9.285]",
             geom);
    ck_assert_int_eq(molq_db_read_string(js, strlen(js), &db, err,
                                         sizeof err), code);
    ck_assert_msg(strstr(err, want) != NULL, "got: %s\nwant: %s", err, want);
    ck_assert_ptr_null(db);
}

#define G_O "{\"element\": \"O\", \"xyz\": [0, 0, 0]}"
#define G_H1 "{\"element\": \"H\", \"xyz\": [0.757, 0.586, 0]}"
#define G_H2 "{\"element\": \"H\", \"xyz\": [-0.757, 0.586, 0]}"

START_TEST(geometry_input_errors)
{
    char many[8192];
    size_t i;
    /* an element the formula lacks */
    geometry_error("[" G_O ", " G_H1 ", {\"element\": \"S\", \"xyz\": "
                   "[0, 1, 0]}]", "H2O", "nonlinear", MOLQ_EVALUE,
                   "species 'G': field 'geometry[2].element': 'S' is not in "
                   "formula 'H2O'");
    geometry_error("[" G_O ", " G_H1 ", {\"element\": \"Hx\", \"xyz\": "
                   "[0, 1, 0]}]", "H2O", "nonlinear", MOLQ_EVALUE,
                   "field 'geometry[2].element': unknown element 'Hx'");
    geometry_error("[" G_O ", " G_H1 "]", "H2O", "nonlinear", MOLQ_EVALUE,
                   "field 'geometry': 1 'H' atom, but formula 'H2O' has 2");
    /* missing or malformed xyz, element */
    geometry_error("[" G_O ", " G_H1 ", {\"element\": \"H\"}]", "H2O",
                   "nonlinear", MOLQ_EKEY,
                   "species 'G': field 'geometry[2].xyz': missing");
    geometry_error("[" G_O ", " G_H1 ", {\"xyz\": [0, 1, 0]}]", "H2O",
                   "nonlinear", MOLQ_EKEY,
                   "field 'geometry[2].element': missing");
    geometry_error("[" G_O ", " G_H1 ", {\"element\": \"H\", \"xyz\": "
                   "[0, 1]}]", "H2O", "nonlinear", MOLQ_ETYPE,
                   "field 'geometry[2].xyz': expected [x, y, z]");
    geometry_error("[" G_O ", " G_H1 ", {\"element\": \"H\", \"xyz\": "
                   "[0, \"1\", 0]}]", "H2O", "nonlinear", MOLQ_ETYPE,
                   "field 'geometry[2].xyz': expected a number");
    geometry_error("[" G_O ", " G_H1 ", {\"element\": 1, \"xyz\": "
                   "[0, 1, 0]}]", "H2O", "nonlinear", MOLQ_ETYPE,
                   "field 'geometry[2].element': expected a string");
    geometry_error("[" G_O ", " G_H1 ", {\"element\": \"H\", \"xyz\": "
                   "[0, 1, 0], \"mass\": 2}]", "H2O", "nonlinear", MOLQ_EKEY,
                   "field 'geometry[2].mass': unknown key");
    geometry_error("{\"O\": [0, 0, 0]}", "H2O", "nonlinear", MOLQ_ETYPE,
                   "field 'geometry': expected an array");
    geometry_error("[" G_O ", " G_H1 ", 3]", "H2O", "nonlinear", MOLQ_ETYPE,
                   "field 'geometry[2]': expected an object");
    /* values */
    geometry_error("[" G_O ", " G_H1 ", {\"element\": \"H\", \"xyz\": "
                   "[0, 1e9, 0]}]", "H2O", "nonlinear", MOLQ_EVALUE,
                   "field 'geometry[2].xyz': must be three finite numbers");
    geometry_error("[" G_O ", " G_H1 ", {\"element\": \"H\", \"xyz\": "
                   "[0.75, 0.586, 0]}]", "H2O", "nonlinear", MOLQ_EVALUE,
                   "field 'geometry[2].xyz': 0.007 Angstrom from "
                   "geometry[1]");
    geometry_error("[" G_O ", " G_H1 ", " G_H2 "]", NULL, "nonlinear",
                   MOLQ_EKEY, "field 'geometry': needs 'formula'");
    geometry_error("[" G_O "]", "O", "atom", MOLQ_EVALUE,
                   "field 'geometry': an atom has no geometry");
    /* too many atoms: 65 */
    strcpy(many, "[");
    for (i = 0; i < 65; i++)
        snprintf(many + strlen(many), sizeof many - strlen(many),
                 "%s{\"element\": \"H\", \"xyz\": [%zu, 0, 0]}",
                 i ? ", " : "", i);
    strcat(many, "]");
    geometry_error(many, "H65", "nonlinear", MOLQ_ELIMIT,
                   "species 'G': field 'geometry': at most 64 atoms (got "
                   "65)");
    /* 64, at the limit, load (an invented chain H64, 1 A apart; its
     * constants do not fit, which is a warning) */
    {
        char js[16384];
        molq_db *db;
        const molq_species *sp;
        strcpy(many, "[");
        for (i = 0; i < 64; i++)
            snprintf(many + strlen(many), sizeof many - strlen(many),
                     "%s{\"element\": \"H\", \"xyz\": [%zu, 0, 0]}",
                     i ? ", " : "", i);
        strcat(many, "]");
        snprintf(js, sizeof js,
                 "{\"schema_version\": 1, \"species\": [{\"name\": "
                 "\"G\", \"formula\": \"H64\", \"structure\": "
                 "\"linear\", \"symmetry_number\": 2, "
                 "\"rotational_constants\": [1.0], \"geometry\": %s}]}",
                 many);
        sp = tu_from_json(js, &db);
        ck_assert_uint_eq(molq_species_warning_count(sp), 1);
        ck_assert_ptr_nonnull(strstr(molq_species_warning(sp, 0),
                                     "'rotational_constants[0]'"));
        molq_db_free(db);
    }
}
END_TEST

/* The setter: argument checks, the 64-atom limit, and the same check for
 * a species built through the spec. */
START_TEST(geometry_setter)
{
    molq_spec *s;
    molq_species *sp;
    const double b[3] = {27.877, 14.512, 9.285};
    double p[3][3];
    char err[256];
    size_t i;
    ck_assert_int_eq(molq_spec_add_geometry_atom(NULL, "O", 0, 0, 0),
                     MOLQ_EARG);
    ck_assert_int_eq(molq_spec_new("W", &s), MOLQ_OK);
    ck_assert_int_eq(molq_spec_add_geometry_atom(s, NULL, 0, 0, 0),
                     MOLQ_EARG);
    for (i = 0; i < 64; i++)
        ck_assert_int_eq(molq_spec_add_geometry_atom(s, "H", (double)i, 0, 0),
                         MOLQ_OK);
    ck_assert_int_eq(molq_spec_add_geometry_atom(s, "H", 64, 0, 0),
                     MOLQ_ELIMIT);
    molq_spec_free(s);

    h2o_geometry(p, 1);
    ck_assert_int_eq(molq_spec_new("W", &s), MOLQ_OK);
    ck_assert_int_eq(molq_spec_set_formula(s, "H2O"), MOLQ_OK);
    ck_assert_int_eq(molq_spec_set_structure(s, MOLQ_NONLINEAR), MOLQ_OK);
    ck_assert_int_eq(molq_spec_set_symmetry_number(s, 2), MOLQ_OK);
    ck_assert_int_eq(molq_spec_set_rotational_constants(s, b, 3), MOLQ_OK);
    ck_assert_int_eq(molq_spec_add_geometry_atom(s, "O", p[0][0], p[0][1],
                                                 p[0][2]), MOLQ_OK);
    ck_assert_int_eq(molq_spec_add_geometry_atom(s, "H", p[1][0], p[1][1],
                                                 p[1][2]), MOLQ_OK);
    /* the second H 10 % farther out: A, B and C move by 5-12 % */
    ck_assert_int_eq(molq_spec_add_geometry_atom(
                         s, "H", p[0][0] + 1.1 * (p[2][0] - p[0][0]),
                         p[0][1] + 1.1 * (p[2][1] - p[0][1]),
                         p[0][2] + 1.1 * (p[2][2] - p[0][2])), MOLQ_OK);
    ck_assert_int_eq(molq_species_create(s, &sp, err, sizeof err), MOLQ_OK);
    ck_assert_uint_ge(molq_species_warning_count(sp), 1);
    ck_assert_ptr_nonnull(strstr(molq_species_warning(sp, 0),
                                 "species 'W': field 'rotational_constants["));
    molq_species_free(sp);
    /* a wrong element through the setter is refused at creation */
    ck_assert_int_eq(molq_spec_add_geometry_atom(s, "Xenonium", 0, 0, 5),
                     MOLQ_OK);
    ck_assert_int_eq(molq_species_create(s, &sp, err, sizeof err),
                     MOLQ_EVALUE);
    ck_assert_msg(strstr(err, "field 'geometry[3].element': unknown element "
                              "'Xenoniu'"), "%s", err);
    molq_spec_free(s);
}
END_TEST

int main(void)
{
    Suite *s = suite_create("plausible");
    TCase *tc = tcase_create("diatomic");
    tcase_add_test(tc, good_entry_is_quiet);
    tcase_add_test(tc, kratzer_flags_de);
    tcase_add_test(tc, pekeris_flags_alpha);
    tcase_add_test(tc, turnover_flags_d0);
    tcase_add_test(tc, dunham_input);
    tcase_add_test(tc, be_against_re);
    tcase_add_test(tc, d0_against_enthalpies);
    tcase_add_test(tc, d0_ion_against_enthalpies);
    tcase_add_test(tc, builtin_set);
    suite_add_tcase(s, tc);
    tc = tcase_create("geometry");
    tcase_add_test(tc, geometry_h2o_hand_calculation);
    tcase_add_test(tc, geometry_co2_bond_too_long);
    tcase_add_test(tc, geometry_shape);
    tcase_add_test(tc, geometry_input_errors);
    tcase_add_test(tc, geometry_setter);
    suite_add_tcase(s, tc);
    return tu_run(s);
}
