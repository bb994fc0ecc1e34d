/* embed.c -- the smallest complete use of molq from C.
 *
 * Build against an installed molq:  cc embed.c $(pkg-config --cflags --libs molq)
 * Shows: opening the built-in species, scalar, multi-property and batch
 * evaluation, building a species from constants, and error handling with a
 * caller-owned message buffer. */
#include <stdio.h>

#include <molq/molq.h>

int main(void)
{
    char err[256];
    molq_db *db = NULL;
    const molq_species *n2 = NULL;
    molq_spec *spec = NULL;
    molq_species *own = NULL;
    double cp, T[4] = {300.0, 600.0, 900.0, 1200.0}, h[4];
    molq_property props[3] = {MOLQ_CP, MOLQ_H, MOLQ_S};
    double v[3];
    double B = 0.5; /* invented test molecule, cm^-1 */
    size_t i;

    if (molq_version_number() / 10000 != MOLQ_VERSION_MAJOR) {
        fprintf(stderr, "header and library disagree on the major version\n");
        return 1;
    }
    if (molq_db_builtin(&db, err, sizeof err) != MOLQ_OK ||
        molq_db_find(db, "N2", &n2) != MOLQ_OK) {
        fprintf(stderr, "molq: %s\n", err);
        return 1;
    }

    /* One property at one state. */
    if (molq_eval(n2, 1000.0, MOLQ_P_STANDARD, MOLQ_CP, &cp) == MOLQ_OK)
        printf("N2 cp(1000 K) = %.4f J/(mol K)\n", cp);

    /* Several properties at once: the partition function is summed once. */
    if (molq_eval_many(n2, 1500.0, 2.0e5, props, 3, v) == MOLQ_OK)
        printf("N2 at 1500 K, 2 bar: cp %.3f J/(mol K), h %.1f J/mol, "
               "s %.3f J/(mol K)\n", v[0], v[1], v[2]);

    /* A batch over temperatures (strides count doubles). */
    if (molq_eval_batch(n2, MOLQ_H, MOLQ_P_STANDARD, T, 1, h, 1, 4) == MOLQ_OK)
        for (i = 0; i < 4; i++)
            printf("N2 h(%4.0f K) = %9.1f J/mol\n", T[i], h[i]);

    /* A species from constants; a mistake gets a message naming the field. */
    molq_spec_new("demo-linear", &spec);
    molq_spec_set_molar_mass(spec, 0.044);
    molq_spec_set_structure(spec, MOLQ_LINEAR);
    molq_spec_set_rotational_constants(spec, &B, 1);
    molq_spec_add_vibration(spec, -120.0, 1); /* deliberate error */
    if (molq_species_create(spec, &own, err, sizeof err) != MOLQ_OK)
        printf("rejected as expected: %s\n", err);

    /* Errors in evaluation come back as status codes. */
    printf("T = -5 K gives: %s\n",
           molq_status_string(molq_eval(n2, -5.0, 1e5, MOLQ_CP, &cp)));

    molq_species_free(own);
    molq_spec_free(spec);
    molq_db_free(db);
    return 0;
}
