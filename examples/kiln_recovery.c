/* kiln_recovery.c -- demo: heat recoverable from a kiln's exhaust.
 *
 * An invented scenario: the gas-fired tunnel kiln at the (fictional)
 * Marrowby brickworks sends its exhaust through a recuperator that preheats
 * combustion air.  How much heat can the recuperator take out of the
 * exhaust as it cools from T_in to T_out?  Ideal-gas mixture, no
 * condensation (T_out stays above the water dew point), no reactions:
 *
 *   Q = n_dot * sum_i x_i [h_i(T_in) - h_i(T_out)]
 *
 * with species enthalpies from molq's built-in data.  All plant numbers are
 * invented for the demo.
 *
 * CAUTION: ideal-gas estimates.  Not a basis for the design of pressure
 * equipment, burners or safety systems without verification under the
 * applicable codes and licensed engineering review. */
#include <stdio.h>

#include <molq/molq.h>

struct component {
    const char *name;
    double x; /* mole fraction */
};

int main(void)
{
    /* Exhaust of natural gas burnt with about 25 % excess air (invented). */
    static const struct component exhaust[] = {
        {"N2", 0.715}, {"O2", 0.040}, {"CO2", 0.080}, {"H2O", 0.165}};
    const double n_dot = 3.2;   /* mol/s of exhaust (invented) */
    const double T_in = 1180.0; /* K, kiln exit */
    const double T_out = 460.0; /* K, recuperator exit */
    const double p = 1.0e5;     /* Pa */
    char err[256];
    molq_db *db;
    double q_total = 0.0, cp_in = 0.0, cp_out = 0.0;
    size_t i;

    if (molq_db_builtin(&db, err, sizeof err) != MOLQ_OK) {
        fprintf(stderr, "molq: %s\n", err);
        return 1;
    }
    printf("Marrowby kiln recuperator (invented scenario)\n");
    printf("exhaust %.2f mol/s cooled from %.0f K to %.0f K at %.0f Pa\n\n",
           n_dot, T_in, T_out, p);
    printf("%-5s %6s %14s %14s %10s\n", "gas", "x", "h(Tin) J/mol",
           "h(Tout) J/mol", "Q kW");
    for (i = 0; i < sizeof exhaust / sizeof exhaust[0]; i++) {
        const molq_species *sp;
        double h_in, h_out, c_in, c_out, q;
        if (molq_db_find(db, exhaust[i].name, &sp) != MOLQ_OK ||
            molq_eval(sp, T_in, p, MOLQ_H, &h_in) != MOLQ_OK ||
            molq_eval(sp, T_out, p, MOLQ_H, &h_out) != MOLQ_OK ||
            molq_eval(sp, T_in, p, MOLQ_CP, &c_in) != MOLQ_OK ||
            molq_eval(sp, T_out, p, MOLQ_CP, &c_out) != MOLQ_OK) {
            fprintf(stderr, "molq: cannot evaluate %s\n", exhaust[i].name);
            molq_db_free(db);
            return 1;
        }
        q = n_dot * exhaust[i].x * (h_in - h_out);
        q_total += q;
        cp_in += exhaust[i].x * c_in;
        cp_out += exhaust[i].x * c_out;
        printf("%-5s %6.3f %14.1f %14.1f %10.2f\n", exhaust[i].name,
               exhaust[i].x, h_in, h_out, q / 1e3);
    }
    printf("\nrecoverable heat: %.1f kW\n", q_total / 1e3);
    printf("mixture cp: %.2f J/(mol K) at %.0f K, %.2f J/(mol K) at %.0f K\n",
           cp_in, T_in, cp_out, T_out);
    printf("(a constant cp taken at %.0f K would give %.1f kW)\n", T_out,
           n_dot * cp_out * (T_in - T_out) / 1e3);
    printf("\nCAUTION: ideal-gas estimate; not for the design of pressure "
           "equipment,\nburners or safety systems without verification under "
           "applicable codes\nand licensed engineering review.\n");
    molq_db_free(db);
    return 0;
}
