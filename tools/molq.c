/* molq.c -- command-line tool: ideal-gas property tables from molecular
 * constants, built on libmolq.
 *
 *   molq table SPECIES... [--data FILE] [--T LIST|START:STOP:STEP] [--p PA]
 *                         [--format text|csv|json] [--per-mass]
 *                         [--model NAME | --compare NAME,NAME...]
 *   molq modes SPECIES... [--data FILE] [--T ...] [--p PA] [--format ...]
 *                         [--model NAME]
 *   molq spin SPECIES...  [--data FILE] [--T ...] [--format ...]
 *                         [--per-mass] [--model NAME]
 *   molq list [--data FILE] [--format ...]     (also: molq species)
 *   molq show SPECIES... [--data FILE] [--format text|json]
 *   molq help [COMMAND] | COMMAND --help | --help | --version
 *
 * With --model or --compare, csv output names the model asked for and the
 * model used (an atom asked for a model it has no data for keeps its own,
 * with a note); csv and json numbers are the shortest decimals that read
 * back as the same double.
 *
 * Exit status: 0 success, 1 data or evaluation error, 2 usage error. */
#include <errno.h>
#include <jansson.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "molq/molq.h"

#include "args.h"

enum { EXIT_DATA = 1, EXIT_USAGE = 2 };
enum { FMT_TEXT, FMT_CSV, FMT_JSON };
enum { CMD_TABLE, CMD_MODES, CMD_LIST, CMD_SPIN, CMD_SHOW, N_CMDS };

static const char *const cmd_name[N_CMDS] = {"table", "modes", "list",
                                             "spin", "show"};

/* Other words for a command: `molq species` is `molq list` (both names
 * stay; messages name the word typed). */
static const struct {
    const char *word;
    int cmd;
} cmd_alias[] = {{"species", CMD_LIST}};
#define N_ALIASES (sizeof cmd_alias / sizeof cmd_alias[0])

/* @return the command `word` names (a command name or an alias), or
 *         N_CMDS when it names none. */
static int find_command(const char *word)
{
    int c;
    size_t a;
    for (c = 0; c < N_CMDS; c++)
        if (strcmp(word, cmd_name[c]) == 0)
            return c;
    for (a = 0; a < N_ALIASES; a++)
        if (strcmp(word, cmd_alias[a].word) == 0)
            return cmd_alias[a].cmd;
    return N_CMDS;
}

/* The models of the library with the one line the help text gives each;
 * their names come from the library (molq_model_name), as in species
 * files.  A new molq_model value needs one new line here. */
static const struct {
    molq_model id;
    const char *about;
} model_table[] = {
    {MOLQ_MODEL_RRHO,
     "rigid rotor, harmonic vibrations, electronic level list (fast)"},
    {MOLQ_MODEL_LEVELS,
     "sums over levels: diatomic ro-vibrational, hindered rotors"},
};
#define N_MODELS (sizeof model_table / sizeof model_table[0])

static const char *model_name(molq_model id)
{
    const char *name = molq_model_name(id);
    return name != NULL ? name : "unknown";
}

static const char help_head[] =
    "molq -- ideal-gas thermodynamic properties from molecular constants\n"
    "\n"
    "Usage:\n"
    "  molq table SPECIES... [--data FILE] [--T TEMPS] [--p PASCAL]\n"
    "                        [--format text|csv|json] [--per-mass]\n"
    "                        [--model NAME | --compare NAME,NAME...]\n"
    "  molq modes SPECIES... [--data FILE] [--T TEMPS] [--p PASCAL]\n"
    "                        [--format text|csv|json] [--model NAME]\n"
    "  molq spin SPECIES...  [--data FILE] [--T TEMPS]\n"
    "                        [--format text|csv|json] [--per-mass]\n"
    "                        [--model NAME]\n"
    "  molq list [--data FILE] [--format text|csv|json]   (or: molq species)\n"
    "  molq show SPECIES... [--data FILE] [--format text|json]\n"
    "  molq help [COMMAND] | molq COMMAND --help | molq --help | molq --version\n"
    "\n"
    "Commands:\n"
    "  table   cp, cv, h, s, g, h_minus_h298, gef and dcp_dT of each SPECIES\n"
    "          at each temperature, by statistical mechanics with the\n"
    "          species' model (see Models).\n"
    "  modes   the contribution of each mode (translation, rotation,\n"
    "          vibration, electronic; rovibronic and torsion for the levels\n"
    "          model) to ln q, u, cv and s, with the totals.\n"
    "  spin    ortho-para (even/odd-J) conversion enthalpy\n"
    "          h_frozen - h_equilibrium, J/mol: the heat released when the\n"
    "          frozen mixture (the species' own, or else its high-temperature\n"
    "          even/odd ratio, e.g. normal hydrogen) relaxes to spin\n"
    "          equilibrium at T.  Diatomics with the levels model; zero\n"
    "          (to round-off) when even and odd levels weigh the same; an\n"
    "          error for a species with no spin-isomer model (e.g. H2O).\n"
    "          Default TEMPS:"
    " 20,30,40,50,77,100,150,200,298.15\n"
    "  list    the species available: name, formula, charge, structure,\n"
    "          model, molar mass, whether a formation enthalpy is given,\n"
    "          the validated range (K) and the source's first clause.\n"
    "          'molq species' is the same command.\n"
    "  show    everything molq knows of a species: composition, charge,\n"
    "          ranges, modes, per-number sources, data-check warnings.\n"
    "\n"
    "Models (a species file chooses one per species with \"model\"):\n";

static const char help_tail[] =
    "\n"
    "Options:\n"
    "  --data FILE     also read species from FILE (JSON species file).\n"
    "                  Names are looked up in FILE first, then in the\n"
    "                  built-in starter set.\n"
    "  --T TEMPS       temperatures in K: a comma-separated list such as\n"
    "                  300,400,1000, or an inclusive range START:STOP:STEP\n"
    "                  such as 300:3000:100.  Default:\n"
    "                  298.15,300,400,500,600,800,1000,1500,2000,2500,3000\n"
    "  --p PASCAL      pressure in Pa (default 100000, the standard state).\n"
    "                  Only s, g and gef (and ln q) depend on it.\n"
    "  --format F      text (aligned table, default), csv or json.\n"
    "  --per-mass      (table, spin) per kilogram instead of per mole.\n"
    "  --model NAME    evaluate every SPECIES with model NAME instead of its\n"
    "                  own (the species data must support it; an atom asked\n"
    "                  for levels keeps rrho, with a note).\n"
    "  --compare LIST  (table) one row per model for each species and T,\n"
    "                  e.g. --compare rrho,levels.\n"
    "  --              end of options; later words are species names.\n"
    "  Options may also be written --name=value.\n"
    "\n"
    "Quantities and units (molar; with --per-mass 'mol' becomes 'kg'):\n"
    "  T K;  cp, cv, s, gef J/(mol K);  h, g, h_minus_h298 J/mol;\n"
    "  dcp_dT J/(mol K^2);  modes: lnq dimensionless, u J/mol;\n"
    "  spin: h_frozen_minus_h_eq J/mol.\n"
    "  h(T) = dfH(298.15 K) + [H(T) - H(298.15 K)]; a species without a\n"
    "  formation enthalpy gets dfH = 0.  g = h - T s.\n"
    "  gef = -(g - h(298.15 K))/T.  s is the conventional entropy at p.\n"
    "  In modes, u is a mode's thermal energy above its ground level.\n"
    "\n"
    "Output formats:\n"
    "  csv   table header: species,T,cp,cv,h,s,g,h_minus_h298,gef,dcp_dT\n"
    "        (with --compare: species,model,T,cp,...)\n"
    "        modes header: species,T,mode,lnq,u,cv,s\n"
    "        spin header:  species,T,h_frozen_minus_h_eq\n"
    "        list header:  name,formula,charge,structure,model,molar_mass,\n"
    "        formation_enthalpy,t_low,t_high,set,source_summary,source\n"
    "        (with --model or --compare: species,model,model_used,T,...;\n"
    "        model is the one asked for, model_used the one evaluated)\n"
    "  json  {\"units\": {...}, \"pressure\": p, \"basis\": ...,\n"
    "         \"species\": [{\"name\": ..., \"model\": ...,\n"
    "                      \"rows\": [{\"T\": ..., ...}]}]}\n"
    "        (with --compare each species has \"models\": [{\"model\": ...,\n"
    "        \"rows\": [...]}] instead of \"model\" and \"rows\");\n"
    "        \"model\" is the model asked for (or the species' own),\n"
    "        \"model_used\" the one evaluated.\n"
    "  csv and json numbers are the shortest decimals that read back as the\n"
    "  same doubles; text rounds to 7 or 8 significant digits.\n"
    "\n"
    "Exit status: 0 success, 1 data or evaluation error, 2 usage error.\n"
    "\n"
    "CAUTION: molq gives ideal-gas estimates. They are not a basis for the\n"
    "design of pressure equipment, burners or safety systems without\n"
    "verification under the applicable codes and licensed engineering\n"
    "review.\n";

static void print_help(FILE *f)
{
    size_t i;
    fputs(help_head, f);
    for (i = 0; i < N_MODELS; i++)
        fprintf(f, "  %-10s %s\n", model_name(model_table[i].id),
                model_table[i].about);
    fputs("  Default: each species' own model (shown by 'molq list').\n", f);
    fputs(help_tail, f);
    fputs("\nRun 'molq help COMMAND' (or 'molq COMMAND --help') for one "
          "command's usage,\noptions and an example.\n", f);
}

/* ------------------------------------------------------------------------ */
/* Help of one command                                                      */
/* ------------------------------------------------------------------------ */

/* The short caution of the commands whose numbers feed design work. */
static const char help_caution[] =
    "\n"
    "CAUTION: ideal-gas estimates.  Do not size burners, pressure equipment\n"
    "or safety systems with them without review under the applicable codes\n"
    "by a licensed engineer.\n";

static const struct {
    const char *usage;    /* after "Usage: " */
    const char *about;    /* what the command prints */
    const char *temps;    /* default of --T, NULL: no --T */
    const char *example;  /* comment line(s) and command, indented */
    int caution;
} cmd_help[N_CMDS] = {
    /* CMD_TABLE */
    {"molq table SPECIES... [--data FILE] [--T TEMPS] [--p PASCAL]\n"
     "                  [--format text|csv|json] [--per-mass]\n"
     "                  [--model NAME | --compare NAME,NAME...]\n",
     "Ideal-gas properties of each SPECIES at each temperature, by\n"
     "statistical mechanics with the species' model: cp, cv, s, gef in\n"
     "J/(mol K); h, g, h_minus_h298 in J/mol; dcp_dT in J/(mol K^2).\n"
     "h(T) = dfH(298.15 K) + [H(T) - H(298.15 K)] (dfH = 0 when the species\n"
     "has none); g = h - T s; gef = -(g - h(298.15 K))/T.\n"
     "With --model or --compare, csv gets the columns model (asked for) and\n"
     "model_used (evaluated) and json the keys \"model\" and \"model_used\";\n"
     "an atom asked for a model it has no data for (levels) uses its own and\n"
     "says so.\n",
     "298.15,300,400,500,600,800,1000,1500,2000,2500,3000",
     "  # An invented test rig: the flue gas of a small electric glass kiln,\n"
     "  # both models side by side from 300 K to 1500 K.\n"
     "  molq table CO2 H2O N2 --T 300:1500:200 --compare rrho,levels "
     "--format csv\n",
     1},
    /* CMD_MODES */
    {"molq modes SPECIES... [--data FILE] [--T TEMPS] [--p PASCAL]\n"
     "                  [--format text|csv|json] [--model NAME]\n",
     "The contribution of each mode (translation, rotation, vibration,\n"
     "electronic; rovibronic and torsion for the levels model) to ln q\n"
     "(dimensionless), u (J/mol, thermal energy above the mode's ground\n"
     "level), cv and s (J/(mol K)), with the species totals.  With --model,\n"
     "csv and json also name the model asked for and the model_used.\n",
     "298.15,300,400,500,600,800,1000,1500,2000,2500,3000",
     "  # An invented bench test: which modes carry the heat capacity of the\n"
     "  # ethane in a made-up heated sample cell at 300 K and 900 K?\n"
     "  molq modes C2H6 --T 300,900\n",
     0},
    /* CMD_LIST */
    {"molq list [--data FILE] [--format text|csv|json]\n"
     "       molq species [--data FILE] [--format text|csv|json]\n",
     "The species available ('molq species' is the same command): name,\n"
     "formula, charge (elementary charges, from the formula), structure,\n"
     "model, molar mass (g/mol), whether a formation enthalpy is given, the\n"
     "validated range (T_low-T_high in K, the range checked against\n"
     "published tables; '-' when the data state none), the set it comes\n"
     "from and a one-line source summary: the source's first clause (up to\n"
     "its first ';' outside parentheses), white space runs made one space,\n"
     "cut at a word to at most 60 characters with '...' when longer.\n"
     "csv and json also carry the whole source (column/key \"source\"; the\n"
     "summary is \"source_summary\"); csv columns: name,formula,charge,\n"
     "structure,model,molar_mass,formation_enthalpy,t_low,t_high,set,\n"
     "source_summary,source (t_low and t_high empty without a range); json\n"
     "\"validated_range\" is [T_low, T_high] or null.\n"
     "'molq show NAME' prints the whole source.\n",
     NULL,
     "  # The species of an invented rig's own file, then the built-in set.\n"
     "  molq list --data rig_gases.json\n",
     0},
    /* CMD_SPIN */
    {"molq spin SPECIES... [--data FILE] [--T TEMPS] [--format text|csv|json]\n"
     "                 [--per-mass] [--model NAME]\n",
     "Ortho-para (even/odd-J) conversion enthalpy h_frozen - h_equilibrium,\n"
     "J/mol (J/kg with --per-mass): the heat released when the frozen\n"
     "mixture (the species' own, or its high-temperature even/odd ratio,\n"
     "e.g. normal hydrogen) relaxes to spin equilibrium at T.  molq has a\n"
     "spin-isomer model for diatomics described by diatomic_states (model\n"
     "levels); for any other species (e.g. H2O, CH4, an atom) the command\n"
     "fails with exit status 1 and says so.  Heteronuclear diatomics give 0.\n"
     "With --model, csv and json also name the model asked for and the\n"
     "model_used.\n",
     "20,30,40,50,77,100,150,200,298.15",
     "  # An invented bench dewar: heat given off per kilogram when its\n"
     "  # freshly liquefied hydrogen converts at 20 K, and at 77 K.\n"
     "  molq spin H2 --T 20,77 --per-mass\n",
     1},
    /* CMD_SHOW */
    {"molq show SPECIES... [--data FILE] [--format text|json]\n",
     "What molq knows of each SPECIES (a name, or a formula such as CO2):\n"
     "formula, element composition and charge, structure, model, molar mass\n"
     "(g/mol), formation enthalpy, the lowest meaningful temperature\n"
     "(t_min, K), the range checked against published tables\n"
     "(validated_range, K), its modes, the data source with the source of\n"
     "each number, and the warnings of the data checks (molar mass against\n"
     "the formula, plausibility of the constants).\n",
     NULL,
     "  # Before feeding an invented kiln model: what is behind the built-in\n"
     "  # water and nitric oxide?\n"
     "  molq show H2O NO\n",
     0},
};

/* The help line(s) of each option, as in opt_table's order (OPT_*). */
static const char *const opt_help[] = { /* indexed by OPT_* (below) */
    "  --data FILE     also read species from FILE (JSON species file);\n"
    "                  names are looked up there first, then built-in.\n",
    "  --T TEMPS       temperatures in K: a list 300,400,1000 or an inclusive\n"
    "                  range START:STOP:STEP such as 300:3000:100.\n",
    "  --p PASCAL      pressure in Pa (default 100000); s, g, gef and ln q\n"
    "                  depend on it.\n",
    "  --format F      text (aligned table, default), csv or json.  csv and\n"
    "                  json numbers are the shortest decimals that read back\n"
    "                  as the same doubles.\n",
    "  --per-mass      per kilogram instead of per mole.\n",
    "  --model NAME    evaluate every SPECIES with model NAME (rrho or levels)\n"
    "                  instead of its own.\n",
    "  --compare LIST  one row per model for each species and T, e.g.\n"
    "                  --compare rrho,levels.\n",
};

/* Levenshtein distance of two short words (for "did you mean"). */
static size_t edit_distance(const char *a, const char *b)
{
    size_t la = strlen(a), lb = strlen(b), i, j;
    size_t row[64], prev, tmp;
    if (la >= 64 || lb >= 64)
        return (size_t)-1;
    for (j = 0; j <= lb; j++)
        row[j] = j;
    for (i = 1; i <= la; i++) {
        prev = row[0];
        row[0] = i;
        for (j = 1; j <= lb; j++) {
            size_t best = prev + (a[i - 1] != b[j - 1]);
            if (row[j] + 1 < best)
                best = row[j] + 1;
            if (row[j - 1] + 1 < best)
                best = row[j - 1] + 1;
            tmp = row[j];
            row[j] = best;
            prev = tmp;
        }
    }
    return row[lb];
}

/* The command name or alias nearest to `word`. */
static const char *nearest_command(const char *word)
{
    size_t best = (size_t)-1, d, a;
    const char *pick = cmd_name[0];
    int c;
    for (c = 0; c < N_CMDS; c++)
        if ((d = edit_distance(word, cmd_name[c])) < best) {
            best = d;
            pick = cmd_name[c];
        }
    for (a = 0; a < N_ALIASES; a++)
        if ((d = edit_distance(word, cmd_alias[a].word)) < best) {
            best = d;
            pick = cmd_alias[a].word;
        }
    return pick;
}

static const double default_T[] = {298.15, 300,  400,  500,  600, 800,
                                   1000,   1500, 2000, 2500, 3000};
/* Default temperatures of `molq spin`: the conversion matters when cold. */
static const double default_T_spin[] = {20, 30, 40, 50, 77, 100, 150, 200,
                                        298.15};

/* Properties of `molq table`, in column order. */
static const molq_property table_props[] = {
    MOLQ_CP, MOLQ_CV, MOLQ_H, MOLQ_S, MOLQ_G, MOLQ_H_MINUS_H298, MOLQ_GEF,
    MOLQ_DCP_DT};
#define N_TABLE (sizeof table_props / sizeof table_props[0])

/* Per-mode properties of `molq modes`, in column order. */
static const molq_property mode_props[] = {MOLQ_LNQ, MOLQ_U, MOLQ_CV, MOLQ_S};
#define N_MODE (sizeof mode_props / sizeof mode_props[0])
static const char *const mode_units[N_MODE] = {"1", "J/mol", "J/(mol K)",
                                               "J/(mol K)"};

/* ------------------------------------------------------------------------ */
/* Options                                                                  */
/* ------------------------------------------------------------------------ */

enum {
    OPT_DATA,
    OPT_T,
    OPT_P,
    OPT_FORMAT,
    OPT_PER_MASS,
    OPT_MODEL,
    OPT_COMPARE,
    N_OPTS
};

/* Bits of the commands an option applies to. */
#define FOR_TABLE (1u << CMD_TABLE)
#define FOR_MODES (1u << CMD_MODES)
#define FOR_LIST (1u << CMD_LIST)
#define FOR_SPIN (1u << CMD_SPIN)
#define FOR_SHOW (1u << CMD_SHOW)

static const struct {
    const char *name;
    int takes_value;
    unsigned commands; /* bit i set: accepted by command i */
} opt_table[N_OPTS] = {
    {"--data", 1, FOR_TABLE | FOR_MODES | FOR_LIST | FOR_SPIN | FOR_SHOW},
    {"--T", 1, FOR_TABLE | FOR_MODES | FOR_SPIN},
    {"--p", 1, FOR_TABLE | FOR_MODES},
    {"--format", 1, FOR_TABLE | FOR_MODES | FOR_LIST | FOR_SPIN | FOR_SHOW},
    {"--per-mass", 0, FOR_TABLE | FOR_SPIN},
    {"--model", 1, FOR_TABLE | FOR_MODES | FOR_SPIN},
    {"--compare", 1, FOR_TABLE},
};
/* opt_help has one entry per option. */
typedef char opt_help_count_check
    [sizeof opt_help / sizeof opt_help[0] == N_OPTS ? 1 : -1];

static void print_command_help(FILE *f, int cmd)
{
    int k;
    fprintf(f, "Usage: %s\n%s\nOptions:\n", cmd_help[cmd].usage,
            cmd_help[cmd].about);
    for (k = 0; k < N_OPTS; k++) {
        if (!(opt_table[k].commands & (1u << cmd)))
            continue;
        fputs(opt_help[k], f);
        if (k == OPT_T && cmd_help[cmd].temps != NULL) 
            fprintf(f, "                  Default: %s\n", cmd_help[cmd].temps);
    }
    fputs("  --help, -h      this help.\n"
          "  Options may also be written --name=value; -- ends the options.\n",
          f);
    fprintf(f, "\nExample:\n%s", cmd_help[cmd].example);
    if (cmd_help[cmd].caution)
        fputs(help_caution, f);
    fputs("\nExit status: 0 success, 1 data or evaluation error, 2 usage "
          "error.\n", f);
}

typedef struct options {
    int cmd;
    const char *word; /* the command as typed ("list" or "species") */
    const char *data_path;
    double *T; /* malloc'ed when given, else points at default_T */
    size_t nT;
    int T_owned;
    double p;
    int format;
    int per_mass;
    const char **names; /* species names (borrowed from argv) */
    size_t nnames;
    int help;
    int model;              /* index into model_table, or -1: own model */
    size_t compare[N_MODELS]; /* --compare: indices into model_table */
    size_t ncompare;          /* 0 without --compare */
} options;

static void usage_error(const char *fmt, const char *a, const char *b)
{
    fputs("molq: ", stderr);
    fprintf(stderr, fmt, a, b);
    fputs("\nmolq: run 'molq --help' for usage\n", stderr);
}

/* Parse the arguments after the command word.  @return 0 or EXIT_USAGE. */
static int parse_options(int cmd, int argc, char **argv, options *o)
{
    int given[N_OPTS] = {0};
    int i, only_names = 0;
    char msg[512];
    const char *models[N_MODELS];
    size_t m;

    for (m = 0; m < N_MODELS; m++)
        models[m] = model_name(model_table[m].id);

    o->names = malloc((size_t)(argc > 0 ? argc : 1) * sizeof *o->names);
    if (o->names == NULL) {
        fputs("molq: out of memory\n", stderr);
        return EXIT_DATA;
    }
    for (i = 0; i < argc; i++) {
        const char *arg = argv[i], *eq, *value = NULL;
        size_t len;
        int k;
        if (only_names || arg[0] != '-' || arg[1] == '\0') {
            if (cmd == CMD_LIST) {
                usage_error("'molq %s' takes no species names (got '%s')",
                            o->word, arg);
                return EXIT_USAGE;
            }
            o->names[o->nnames++] = arg;
            continue;
        }
        if (strcmp(arg, "--") == 0) {
            only_names = 1;
            continue;
        }
        if (strcmp(arg, "--help") == 0 || strcmp(arg, "-h") == 0) {
            o->help = 1;
            continue;
        }
        eq = strchr(arg, '=');
        len = eq ? (size_t)(eq - arg) : strlen(arg);
        for (k = 0; k < N_OPTS; k++)
            if (strlen(opt_table[k].name) == len &&
                strncmp(opt_table[k].name, arg, len) == 0)
                break;
        if (k == N_OPTS) {
            usage_error("unknown option '%s' for 'molq %s'", arg, o->word);
            return EXIT_USAGE;
        }
        if (!(opt_table[k].commands & (1u << cmd))) {
            usage_error("option %s does not apply to 'molq %s'",
                        opt_table[k].name, o->word);
            return EXIT_USAGE;
        }
        if (given[k]) {
            usage_error("option %s given more than once%s", opt_table[k].name,
                        "");
            return EXIT_USAGE;
        }
        given[k] = 1;
        if (opt_table[k].takes_value) {
            if (eq != NULL)
                value = eq + 1;
            else if (i + 1 < argc)
                value = argv[++i];
            else {
                usage_error("option %s needs a value%s", opt_table[k].name,
                            "");
                return EXIT_USAGE;
            }
        } else if (eq != NULL) {
            usage_error("option %s takes no value (got '%s')",
                        opt_table[k].name, arg);
            return EXIT_USAGE;
        }
        switch (k) {
        case OPT_DATA:
            if (value[0] == '\0') {
                usage_error("option --data: empty file name%s%s", "", "");
                return EXIT_USAGE;
            }
            o->data_path = value;
            break;
        case OPT_T:
            if (cli_parse_temperatures("--T", value, &o->T, &o->nT, msg,
                                       sizeof msg) != 0) {
                usage_error("%s%s", msg, "");
                return EXIT_USAGE;
            }
            o->T_owned = 1;
            break;
        case OPT_P:
            if (cli_parse_positive("--p", value, &o->p, msg, sizeof msg) !=
                0) {
                usage_error("%s%s", msg, "");
                return EXIT_USAGE;
            }
            break;
        case OPT_FORMAT:
            if (strcmp(value, "text") == 0)
                o->format = FMT_TEXT;
            else if (strcmp(value, "csv") == 0)
                o->format = FMT_CSV;
            else if (strcmp(value, "json") == 0)
                o->format = FMT_JSON;
            else {
                usage_error("option --format: unknown format '%s' (use "
                            "text, csv or json)%s", value, "");
                return EXIT_USAGE;
            }
            break;
        case OPT_PER_MASS:
            o->per_mass = 1;
            break;
        case OPT_MODEL:
            if (cli_parse_choice("--model", "model", value, models, N_MODELS,
                                 &m, msg, sizeof msg) != 0) {
                usage_error("%s%s", msg, "");
                return EXIT_USAGE;
            }
            o->model = (int)m;
            break;
        case OPT_COMPARE:
            if (cli_parse_choice_list("--compare", "model", value, models,
                                      N_MODELS, o->compare, &o->ncompare, msg,
                                      sizeof msg) != 0) {
                usage_error("%s%s", msg, "");
                return EXIT_USAGE;
            }
            break;
        }
    }
    if (given[OPT_MODEL] && given[OPT_COMPARE]) {
        usage_error("options --model and --compare exclude each other (use "
                    "--compare %s,... to include the model%s)",
                    model_name(model_table[o->model].id), "");
        return EXIT_USAGE;
    }
    if (!o->help && cmd != CMD_LIST && o->nnames == 0) {
        usage_error("'molq %s' needs at least one species name%s",
                    o->word, "");
        return EXIT_USAGE;
    }
    return 0;
}

/* ------------------------------------------------------------------------ */
/* Species sets                                                             */
/* ------------------------------------------------------------------------ */

typedef struct sets {
    const char *path; /* --data FILE or NULL */
    molq_db *user;    /* species of FILE, or NULL */
    molq_db *builtin;
} sets;

/* Print the line `line` of file `path` (1-based), shortened around
 * column `col`, to help find a syntax error. */
static void show_file_line(const char *path, long line, long col)
{
    FILE *f = fopen(path, "rb");
    long cur = 1, pos = 0;
    int ch;
    char buf[121];
    size_t n = 0;
    long start;
    if (f == NULL || line < 1)
        goto done;
    start = col > 80 ? col - 80 : 0; /* keep the 80 bytes before col */
    while (cur < line && (ch = getc(f)) != EOF)
        if (ch == '\n')
            cur++;
    if (cur != line)
        goto done;
    while ((ch = getc(f)) != EOF && ch != '\n' && ch != '\r') {
        if (pos++ < start)
            continue;
        if (n < sizeof buf - 1)
            buf[n++] = (ch == '\t') ? ' ' : (char)ch;
    }
    buf[n] = '\0';
    if (pos == 0) {
        fprintf(stderr, "molq: line %ld is empty\n", line);
        goto done;
    }
    fprintf(stderr, "molq: line %ld reads: %s%s%s\n", line,
            start > 0 ? "..." : "", buf,
            (long)n + start < pos ? "..." : "");
done:
    if (f != NULL)
        fclose(f);
}

/* @return 0 or EXIT_DATA (message printed). */
static int load_sets(const char *path, sets *s)
{
    char err[1024];
    molq_status st;
    s->path = path;
    st = molq_db_builtin(&s->builtin, err, sizeof err);
    if (st != MOLQ_OK) {
        fprintf(stderr, "molq: built-in species set: %s (%s)\n", err,
                molq_status_string(st));
        return EXIT_DATA;
    }
    if (path == NULL)
        return 0;
    st = molq_db_read_file(path, &s->user, err, sizeof err);
    if (st != MOLQ_OK) {
        long line, col;
        const char *at = strstr(err, "line "), *msg = err;
        size_t plen = strlen(path);
        /* Name the file once: the library names it in its I/O messages
         * ("PATH: cannot open ...") and says "species file: line ..." for
         * syntax errors. */
        if (strncmp(msg, path, plen) == 0 && msg[plen] == ':' &&
            msg[plen + 1] == ' ')
            msg += plen + 2;
        else if (strncmp(msg, "species file: ", 14) == 0)
            msg += 14;
        if (strstr(msg, path) != NULL)
            fprintf(stderr, "molq: %s (%s)\n", msg, molq_status_string(st));
        else
            fprintf(stderr, "molq: species file '%s': %s (%s)\n", path, msg,
                    molq_status_string(st));
        if (st == MOLQ_ESYNTAX && at != NULL &&
            sscanf(at, "line %ld, column %ld", &line, &col) == 2)
            show_file_line(path, line, col);
        return EXIT_DATA;
    }
    /* The file loaded: its warnings (the file's, then each species') and
     * the built-in species it overrides (names looked up in the file
     * first) go to stderr; results still follow. */
    {
        size_t i, n = molq_db_warning_count(s->user);
        for (i = 0; i < n; i++) {
            const char *w = molq_db_warning(s->user, i);
            if (strncmp(w, "species file: ", 14) == 0)
                w += 14; /* the path names the file */
            fprintf(stderr, "molq: warning: %s: %s\n", path, w);
        }
        n = molq_db_count(s->user);
        for (i = 0; i < n; i++) {
            const char *name = molq_species_name(molq_db_species(s->user, i));
            const molq_species *b;
            if (molq_db_find(s->builtin, name, &b) == MOLQ_OK)
                fprintf(stderr, "molq: note: species '%s' from %s overrides "
                        "the built-in one\n", name, path);
        }
    }
    return 0;
}

static void free_sets(sets *s)
{
    molq_db_free(s->user);
    molq_db_free(s->builtin);
}

/* Look `name` up: --data file first, then the built-in set, by name, then
 * by formula.  @return the species (borrowed) or NULL after printing an
 * error. */
static const molq_species *find_species(const sets *s, const char *name)
{
    const molq_species *sp;
    size_t i, n;
    if (s->user != NULL && molq_db_find(s->user, name, &sp) == MOLQ_OK)
        return sp;
    if (molq_db_find(s->builtin, name, &sp) == MOLQ_OK)
        return sp;
    if (s->user != NULL &&
        molq_db_find_formula(s->user, name, &sp) == MOLQ_OK)
        return sp;
    if (molq_db_find_formula(s->builtin, name, &sp) == MOLQ_OK)
        return sp;
    fprintf(stderr, "molq: unknown species '%s': looked in ", name);
    if (s->path != NULL)
        fprintf(stderr, "species file '%s' (%zu species) and ", s->path,
                molq_db_count(s->user));
    fputs("the built-in set (", stderr);
    n = molq_db_count(s->builtin);
    for (i = 0; i < n; i++)
        fprintf(stderr, "%s%s", i ? ", " : "",
                molq_species_name(molq_db_species(s->builtin, i)));
    fputs("); names are case-sensitive; 'molq list' shows them all\n", stderr);
    return NULL;
}

static const char *structure_of(const molq_species *sp)
{
    switch (molq_species_structure(sp)) {
    case MOLQ_LINEAR:
        return "linear";
    case MOLQ_NONLINEAR:
        return "nonlinear";
    default:
        return "atom";
    }
}

/* ------------------------------------------------------------------------ */
/* Output helpers                                                           */
/* ------------------------------------------------------------------------ */

/* Write a CSV field, quoted when it holds a comma, quote or line break. */
static void csv_field(const char *s)
{
    if (strpbrk(s, ",\"\r\n") == NULL) {
        fputs(s, stdout);
        return;
    }
    putchar('"');
    for (; *s != '\0'; s++) {
        if (*s == '"')
            putchar('"');
        putchar(*s);
    }
    putchar('"');
}

/* Unit of a table property on the chosen basis ("mol" -> "kg"). */
static void unit_of(molq_property prop, int per_mass, char *buf, size_t len)
{
    const char *u = molq_property_unit(prop), *m;
    if (!per_mass || (m = strstr(u, "mol")) == NULL) {
        snprintf(buf, len, "%s", u);
        return;
    }
    snprintf(buf, len, "%.*skg%s", (int)(m - u), u, m + 3);
}

/* Build-time helper for jansson: record allocation failures. */
typedef struct jctx {
    int failed;
} jctx;

static json_t *jcheck(jctx *j, json_t *v)
{
    if (v == NULL)
        j->failed = 1;
    return v;
}

static void jset(jctx *j, json_t *obj, const char *key, json_t *v)
{
    if (obj == NULL || v == NULL || json_object_set_new(obj, key, v) != 0) {
        j->failed = 1;
        json_decref(v);
    }
}

static void jappend(jctx *j, json_t *arr, json_t *v)
{
    if (arr == NULL || v == NULL || json_array_append_new(arr, v) != 0) {
        j->failed = 1;
        json_decref(v);
    }
}

/* The shortest of %.15g, %.16g and %.17g of `v` that strtod reads back as
 * the very same double (%.17g always does).  `buf` needs 32 bytes. */
static const char *fmt_shortest(double v, char *buf, size_t len)
{
    int prec;
    for (prec = 15; prec <= 17; prec++) {
        snprintf(buf, len, "%.*g", prec, v);
        if (strtod(buf, NULL) == v)
            break;
    }
    return buf;
}

/* Print `v` as a csv number (shortest round trip). */
static void csv_number(double v)
{
    char buf[32];
    fputs(fmt_shortest(v, buf, sizeof buf), stdout);
}

/* Print `v` as a JSON real: shortest round trip, with ".0" added to an
 * integral value so that it still reads as a real, as jansson writes it. */
static void json_number(FILE *f, double v)
{
    char buf[40];
    fmt_shortest(v, buf, sizeof buf - 2);
    if (strpbrk(buf, ".eEn") == NULL) /* no fraction, exponent, inf/nan */
        strcat(buf, ".0");
    fputs(buf, f);
}

/* Write `v` to `f` as jansson's JSON_INDENT(2) would, except that reals
 * are printed by json_number.  Everything but objects, arrays and reals
 * is encoded by jansson.  @return 0 or -1 (out of memory). */
static int json_emit(FILE *f, json_t *v, int depth)
{
    size_t i, n;
    const char *key;
    json_t *x;
    char *text;
    int first = 1;
    if (json_is_real(v)) {
        json_number(f, json_real_value(v));
        return 0;
    }
    if (json_is_array(v)) {
        if ((n = json_array_size(v)) == 0) {
            fputs("[]", f);
            return 0;
        }
        fputs("[\n", f);
        for (i = 0; i < n; i++) {
            fprintf(f, "%*s", 2 * (depth + 1), "");
            if (json_emit(f, json_array_get(v, i), depth + 1) != 0)
                return -1;
            fputs(i + 1 < n ? ",\n" : "\n", f);
        }
        fprintf(f, "%*s]", 2 * depth, "");
        return 0;
    }
    if (json_is_object(v)) {
        if (json_object_size(v) == 0) {
            fputs("{}", f);
            return 0;
        }
        fputs("{\n", f);
        json_object_foreach(v, key, x) { /* insertion order (jansson 2.8+) */
            json_t *k = json_string(key);
            if (k == NULL)
                return -1;
            text = json_dumps(k, JSON_ENCODE_ANY);
            json_decref(k);
            if (text == NULL)
                return -1;
            fprintf(f, "%s%*s%s: ", first ? "" : ",\n", 2 * (depth + 1), "",
                    text);
            free(text);
            first = 0;
            if (json_emit(f, x, depth + 1) != 0)
                return -1;
        }
        fprintf(f, "\n%*s}", 2 * depth, "");
        return 0;
    }
    if ((text = json_dumps(v, JSON_ENCODE_ANY)) == NULL)
        return -1;
    fputs(text, f);
    free(text);
    return 0;
}

/* Write `root` to stdout and free it.  @return 0 or EXIT_DATA. */
static int json_finish(jctx *j, json_t *root)
{
    int rc = 0;
    if (j->failed || root == NULL) {
        fputs("molq: out of memory while building JSON output\n", stderr);
        rc = EXIT_DATA;
    } else if (json_emit(stdout, root, 0) != 0) {
        fputs("molq: out of memory while writing JSON output\n", stderr);
        rc = EXIT_DATA;
    } else {
        putchar('\n');
    }
    json_decref(root);
    return rc;
}

static void eval_error(const molq_species *sp, double T, double p,
                       molq_status st)
{
    fprintf(stderr, "molq: species '%s' (model %s) at T = %.12g K",
            molq_species_name(sp), model_name(molq_species_model(sp)), T);
    if (p > 0.0) /* 0: no pressure involved */
        fprintf(stderr, ", p = %.12g Pa", p);
    fprintf(stderr, ": %s", molq_status_string(st));
    if (st == MOLQ_ERANGE)
        fprintf(stderr, " (its models are valid from T = %.12g K up)",
                molq_species_t_min(sp));
    fputc('\n', stderr);
}

static double min_of(const double *x, size_t n)
{
    double m = x[0];
    size_t i;
    for (i = 1; i < n; i++)
        if (x[i] < m)
            m = x[i];
    return m;
}

/* ------------------------------------------------------------------------ */
/* molq table                                                               */
/* ------------------------------------------------------------------------ */

static molq_status table_row(const molq_species *sp, double T, double p,
                             int per_mass, double *out)
{
    size_t k;
    molq_status st;
    if (!per_mass)
        return molq_eval_many(sp, T, p, table_props, N_TABLE, out);
    for (k = 0; k < N_TABLE; k++)
        if ((st = molq_eval_per_mass(sp, T, p, table_props[k], &out[k])) !=
            MOLQ_OK)
            return st;
    return MOLQ_OK;
}

/* The model a species is evaluated with, and the one asked for (`asked`,
 * NULL: the species' own). */
static const char *used_name(const molq_species *sp)
{
    return model_name(molq_species_model(sp));
}

static const char *asked_name(const molq_species *sp, const char *asked)
{
    return asked != NULL ? asked : used_name(sp);
}

/* An atom asked for a model it has no data for keeps its own (main). */
static int fell_back(const molq_species *sp, const char *asked)
{
    return asked != NULL && strcmp(asked, used_name(sp)) != 0;
}

/* csv output names the models when one was asked for. */
static int show_models(const options *o)
{
    return o->model >= 0 || o->ncompare > 0;
}

/* ",model,model_used" of a csv row when show_models. */
static void csv_models(const molq_species *sp, const char *asked,
                       const options *o)
{
    if (show_models(o))
        printf(",%s,%s", asked_name(sp, asked), used_name(sp));
}

/* "model" (asked for, or the species' own) and "model_used" in json. */
static void json_models(jctx *j, json_t *holder, const molq_species *sp,
                        const char *asked)
{
    jset(j, holder, "model", json_string(asked_name(sp, asked)));
    jset(j, holder, "model_used", json_string(used_name(sp)));
}

#define TW 14 /* text column width */

/* Title line of a species in text output; `show_model`: name its model
 * (and the one asked for, `asked`, when the species could not use it). */
static void text_species_title(const molq_species *sp, int show_model,
                               const char *asked)
{
    const char *f = molq_species_formula(sp);
    printf("%s  (%s%s%s%.10g g/mol, ", molq_species_name(sp),
           f[0] ? "formula " : "", f, f[0] ? ", " : "",
           molq_species_molar_mass(sp) * 1e3);
    if (show_model && fell_back(sp, asked))
        printf("model %s: %s asked for, but %s has no %s model, ",
               used_name(sp), asked, molq_species_name(sp), asked);
    else if (show_model)
        printf("model %s, ", used_name(sp));
    printf("%s)\n", molq_species_has_formation_enthalpy(sp)
                        ? "h includes the formation enthalpy at 298.15 K"
                        : "no formation enthalpy: h = h(T) - h(298.15 K)");
}

/* `molq table`: sp holds nm variants (models) of each of nsp species,
 * sp[i * nm + k], asked[i * nm + k] the model asked for (NULL: own);
 * compare != 0 prints a model column (--compare). */
static int cmd_table(const options *o, const molq_species **sp,
                     const char *const *asked, size_t nsp, size_t nm,
                     int compare)
{
    double v[N_TABLE];
    size_t i, t, k, m;
    molq_status st;
    char unit[32];
    double Tmin = min_of(o->T, o->nT);

    /* Evaluate each species at the lowest T first so that a species outside
     * its range fails before any output is written. */
    for (i = 0; i < nsp * nm; i++)
        if ((st = table_row(sp[i], Tmin, o->p, o->per_mass, v)) != MOLQ_OK) {
            eval_error(sp[i], Tmin, o->p, st);
            return EXIT_DATA;
        }

    if (o->format == FMT_JSON) {
        jctx j = {0};
        json_t *root = jcheck(&j, json_object());
        json_t *units = jcheck(&j, json_object()), *list;
        jset(&j, units, "T", json_string("K"));
        for (k = 0; k < N_TABLE; k++) {
            unit_of(table_props[k], o->per_mass, unit, sizeof unit);
            jset(&j, units, molq_property_name(table_props[k]),
                 json_string(unit));
        }
        jset(&j, units, "pressure", json_string("Pa"));
        jset(&j, units, "molar_mass", json_string("g/mol"));
        jset(&j, root, "units", units);
        jset(&j, root, "pressure", json_real(o->p));
        jset(&j, root, "basis", json_string(o->per_mass ? "mass" : "molar"));
        list = jcheck(&j, json_array());
        jset(&j, root, "species", list);
        for (i = 0; i < nsp && !j.failed; i++) {
            const molq_species *first = sp[i * nm];
            json_t *e = jcheck(&j, json_object()), *models = NULL;
            jappend(&j, list, e);
            jset(&j, e, "name", json_string(molq_species_name(first)));
            jset(&j, e, "formula", json_string(molq_species_formula(first)));
            jset(&j, e, "molar_mass",
                 json_real(molq_species_molar_mass(first) * 1e3));
            jset(&j, e, "has_formation_enthalpy",
                 json_boolean(molq_species_has_formation_enthalpy(first)));
            if (compare) {
                models = jcheck(&j, json_array());
                jset(&j, e, "models", models);
            }
            for (m = 0; m < nm && !j.failed; m++) {
                const molq_species *x = sp[i * nm + m];
                json_t *holder = e, *rows;
                if (compare) {
                    holder = jcheck(&j, json_object());
                    jappend(&j, models, holder);
                }
                json_models(&j, holder, x, asked[i * nm + m]);
                rows = jcheck(&j, json_array());
                jset(&j, holder, "rows", rows);
                for (t = 0; t < o->nT && !j.failed; t++) {
                    json_t *r;
                    if ((st = table_row(x, o->T[t], o->p, o->per_mass, v)) !=
                        MOLQ_OK) {
                        eval_error(x, o->T[t], o->p, st);
                        json_decref(root);
                        return EXIT_DATA;
                    }
                    r = jcheck(&j, json_object());
                    jappend(&j, rows, r);
                    jset(&j, r, "T", json_real(o->T[t]));
                    for (k = 0; k < N_TABLE; k++)
                        jset(&j, r, molq_property_name(table_props[k]),
                             json_real(v[k]));
                }
            }
        }
        return json_finish(&j, root);
    }

    if (o->format == FMT_CSV) {
        fputs(show_models(o) ? "species,model,model_used,T" : "species,T",
              stdout);
        for (k = 0; k < N_TABLE; k++)
            printf(",%s", molq_property_name(table_props[k]));
        putchar('\n');
    } else {
        printf("molq ideal-gas properties at p = %.10g Pa, per %s\n", o->p,
               o->per_mass ? "kilogram" : "mole");
    }
    for (i = 0; i < nsp; i++) {
        if (o->format == FMT_TEXT) {
            putchar('\n');
            text_species_title(sp[i * nm], !compare, asked[i * nm]);
            printf("%*s", TW, "T");
            if (compare)
                printf("%*s", TW, "model");
            for (k = 0; k < N_TABLE; k++)
                printf("%*s", TW, molq_property_name(table_props[k]));
            printf("\n%*s", TW, "K");
            if (compare)
                printf("%*s", TW, "");
            for (k = 0; k < N_TABLE; k++) {
                unit_of(table_props[k], o->per_mass, unit, sizeof unit);
                printf("%*s", TW, unit);
            }
            putchar('\n');
        }
        for (t = 0; t < o->nT; t++) {
            for (m = 0; m < nm; m++) {
                const molq_species *x = sp[i * nm + m];
                const char *xa = asked[i * nm + m];
                char mname[64];
                snprintf(mname, sizeof mname, "%s%s", asked_name(x, xa),
                         fell_back(x, xa) ? "*" : "");
                if ((st = table_row(x, o->T[t], o->p, o->per_mass, v)) !=
                    MOLQ_OK) {
                    fflush(stdout);
                    eval_error(x, o->T[t], o->p, st);
                    return EXIT_DATA;
                }
                if (o->format == FMT_CSV) {
                    csv_field(molq_species_name(x));
                    csv_models(x, xa, o);
                    putchar(',');
                    csv_number(o->T[t]);
                    for (k = 0; k < N_TABLE; k++) {
                        putchar(',');
                        csv_number(v[k]);
                    }
                } else {
                    printf("%*.8g", TW, o->T[t]);
                    if (compare)
                        printf("%*s", TW, mname);
                    for (k = 0; k < N_TABLE; k++)
                        printf(" %*.7g", TW - 1, v[k]);
                }
                putchar('\n');
            }
            /* A blank line between temperatures keeps the groups apart. */
            if (compare && o->format == FMT_TEXT && t + 1 < o->nT)
                putchar('\n');
        }
        if (compare && o->format == FMT_TEXT)
            for (m = 0; m < nm; m++)
                if (fell_back(sp[i * nm + m], asked[i * nm + m]))
                    printf("  * %s has no %s model; the rows marked %s* use "
                           "%s\n", molq_species_name(sp[i * nm + m]),
                           asked[i * nm + m], asked[i * nm + m],
                           used_name(sp[i * nm + m]));
    }
    return 0;
}

/* ------------------------------------------------------------------------ */
/* molq modes                                                               */
/* ------------------------------------------------------------------------ */

/* Mode contributions (nmodes x N_MODE, row-major) and the species totals
 * (lnq, u = h - h(0) - RT, cv, s) at one state. */
static molq_status modes_eval(const molq_species *sp, double T, double p,
                              double *per_mode, double *total)
{
    static const molq_property tp[] = {MOLQ_LNQ, MOLQ_H_MINUS_H0, MOLQ_H,
                                       MOLQ_U, MOLQ_CV, MOLQ_S};
    double tv[6];
    size_t m, k, n = molq_species_mode_count(sp);
    molq_status st;
    for (m = 0; m < n; m++)
        for (k = 0; k < N_MODE; k++)
            if ((st = molq_eval_mode(sp, m, T, p, mode_props[k],
                                     &per_mode[m * N_MODE + k])) != MOLQ_OK)
                return st;
    if ((st = molq_eval_many(sp, T, p, tp, 6, tv)) != MOLQ_OK)
        return st;
    total[0] = tv[0];
    total[1] = tv[1] - (tv[2] - tv[3]); /* h - h0 - RT, with RT = h - u */
    total[2] = tv[4];
    total[3] = tv[5];
    return MOLQ_OK;
}

static const char *mode_name(const molq_species *sp, size_t m)
{
    molq_mode_kind kind;
    const char *name;
    if (molq_species_mode_kind(sp, m, &kind) != MOLQ_OK ||
        (name = molq_mode_kind_name(kind)) == NULL)
        return "mode";
    return name;
}

static int cmd_modes(const options *o, const molq_species **sp,
                     const char *const *asked, size_t nsp)
{
    size_t i, t, k, m, maxm = 0;
    double *pm, total[N_MODE];
    molq_status st;
    int rc = 0;
    double Tmin = min_of(o->T, o->nT);

    for (i = 0; i < nsp; i++)
        if (molq_species_mode_count(sp[i]) > maxm)
            maxm = molq_species_mode_count(sp[i]);
    pm = malloc((maxm + 1) * N_MODE * sizeof *pm);
    if (pm == NULL) {
        fputs("molq: out of memory\n", stderr);
        return EXIT_DATA;
    }
    for (i = 0; i < nsp; i++)
        if ((st = modes_eval(sp[i], Tmin, o->p, pm, total)) != MOLQ_OK) {
            eval_error(sp[i], Tmin, o->p, st);
            free(pm);
            return EXIT_DATA;
        }

    if (o->format == FMT_JSON) {
        jctx j = {0};
        json_t *root = jcheck(&j, json_object());
        json_t *units = jcheck(&j, json_object()), *list;
        jset(&j, units, "T", json_string("K"));
        for (k = 0; k < N_MODE; k++)
            jset(&j, units, molq_property_name(mode_props[k]),
                 json_string(mode_units[k]));
        jset(&j, units, "pressure", json_string("Pa"));
        jset(&j, root, "units", units);
        jset(&j, root, "pressure", json_real(o->p));
        list = jcheck(&j, json_array());
        jset(&j, root, "species", list);
        for (i = 0; i < nsp && !j.failed; i++) {
            size_t nm = molq_species_mode_count(sp[i]);
            json_t *e = jcheck(&j, json_object()), *rows, *names;
            jappend(&j, list, e);
            jset(&j, e, "name", json_string(molq_species_name(sp[i])));
            json_models(&j, e, sp[i], asked[i]);
            names = jcheck(&j, json_array());
            for (m = 0; m < nm; m++)
                jappend(&j, names, json_string(mode_name(sp[i], m)));
            jset(&j, e, "modes", names);
            rows = jcheck(&j, json_array());
            jset(&j, e, "rows", rows);
            for (t = 0; t < o->nT && !j.failed; t++) {
                json_t *r, *ml, *tot;
                if ((st = modes_eval(sp[i], o->T[t], o->p, pm, total)) !=
                    MOLQ_OK) {
                    eval_error(sp[i], o->T[t], o->p, st);
                    json_decref(root);
                    free(pm);
                    return EXIT_DATA;
                }
                r = jcheck(&j, json_object());
                jappend(&j, rows, r);
                jset(&j, r, "T", json_real(o->T[t]));
                ml = jcheck(&j, json_array());
                jset(&j, r, "modes", ml);
                for (m = 0; m < nm; m++) {
                    json_t *mo = jcheck(&j, json_object());
                    jappend(&j, ml, mo);
                    jset(&j, mo, "mode", json_string(mode_name(sp[i], m)));
                    for (k = 0; k < N_MODE; k++)
                        jset(&j, mo, molq_property_name(mode_props[k]),
                             json_real(pm[m * N_MODE + k]));
                }
                tot = jcheck(&j, json_object());
                jset(&j, r, "total", tot);
                for (k = 0; k < N_MODE; k++)
                    jset(&j, tot, molq_property_name(mode_props[k]),
                         json_real(total[k]));
            }
        }
        free(pm);
        return json_finish(&j, root);
    }

    if (o->format == FMT_CSV)
        puts(show_models(o) ? "species,model,model_used,T,mode,lnq,u,cv,s"
                            : "species,T,mode,lnq,u,cv,s");
    else
        printf("molq per-mode contributions at p = %.10g Pa, per mole "
               "(u: thermal energy above the mode's ground level)\n",
               o->p);
    for (i = 0; i < nsp && rc == 0; i++) {
        size_t nm = molq_species_mode_count(sp[i]);
        if (o->format == FMT_TEXT) {
            putchar('\n');
            text_species_title(sp[i], 1, asked[i]);
        }
        for (t = 0; t < o->nT; t++) {
            if ((st = modes_eval(sp[i], o->T[t], o->p, pm, total)) !=
                MOLQ_OK) {
                fflush(stdout);
                eval_error(sp[i], o->T[t], o->p, st);
                rc = EXIT_DATA;
                break;
            }
            if (o->format == FMT_TEXT) {
                printf("  T = %.10g K\n%*s", o->T[t], TW, "mode");
                for (k = 0; k < N_MODE; k++)
                    printf("%*s", TW, molq_property_name(mode_props[k]));
                printf("\n%*s", TW, "");
                for (k = 0; k < N_MODE; k++)
                    printf("%*s", TW, mode_units[k]);
                putchar('\n');
            }
            for (m = 0; m <= nm; m++) {
                const char *name = m < nm ? mode_name(sp[i], m) : "total";
                const double *v = m < nm ? &pm[m * N_MODE] : total;
                if (o->format == FMT_CSV) {
                    csv_field(molq_species_name(sp[i]));
                    csv_models(sp[i], asked[i], o);
                    putchar(',');
                    csv_number(o->T[t]);
                    printf(",%s", name);
                    for (k = 0; k < N_MODE; k++) {
                        putchar(',');
                        csv_number(v[k]);
                    }
                } else {
                    printf("%*s", TW, name);
                    for (k = 0; k < N_MODE; k++)
                        printf(" %*.7g", TW - 1, v[k]);
                }
                putchar('\n');
            }
        }
    }
    free(pm);
    return rc;
}

/* ------------------------------------------------------------------------ */
/* molq spin                                                                */
/* ------------------------------------------------------------------------ */

#define SPIN_COLUMN "h_frozen_minus_h_eq"

/* h_frozen - h_equilibrium per mole or per kilogram. */
static molq_status spin_value(const molq_species *sp, double T, int per_mass,
                              double *out)
{
    molq_status st = molq_eval_spin_conversion(sp, T, out);
    if (st == MOLQ_OK && per_mass)
        *out /= molq_species_molar_mass(sp);
    return st;
}

/* Whether the species has a diatomic level sum, the one mode with spin
 * isomers. */
static int has_rovibronic(const molq_species *sp)
{
    size_t m, n = molq_species_mode_count(sp);
    molq_mode_kind kind;
    for (m = 0; m < n; m++)
        if (molq_species_mode_kind(sp, m, &kind) == MOLQ_OK &&
            kind == MOLQ_MODE_ROVIBRONIC)
            return 1;
    return 0;
}

static int cmd_spin(const options *o, const molq_species **sp,
                    const char *const *asked, size_t nsp)
{
    size_t i, t;
    double v, Tmin = min_of(o->T, o->nT);
    const char *unit = o->per_mass ? "J/kg" : "J/mol";
    molq_status st;

    /* The library has spin isomers for diatomic level sums only (a
     * rovibronic mode); for every other species it answers 0 or MOLQ_EARG.
     * Say why, before any output, rather than print a 0 that means "not
     * modelled". */
    for (i = 0; i < nsp; i++) {
        if (molq_species_structure(sp[i]) == MOLQ_ATOM ||
            (molq_species_model(sp[i]) == MOLQ_MODEL_LEVELS &&
             !has_rovibronic(sp[i]))) {
            fprintf(stderr, "molq: %s has no spin-isomer model in molq "
                    "(molq spin covers diatomics described by "
                    "diatomic_states, model levels)\n",
                    molq_species_name(sp[i]));
            return EXIT_DATA;
        }
        st = spin_value(sp[i], Tmin, o->per_mass, &v);
        if (st == MOLQ_EARG &&
            molq_species_model(sp[i]) != MOLQ_MODEL_LEVELS) {
            fprintf(stderr, "molq: species '%s' uses model '%s'; the spin "
                    "conversion enthalpy needs model 'levels' (diatomics "
                    "described by diatomic_states; --model levels switches "
                    "a species that has them)\n",
                    molq_species_name(sp[i]),
                    model_name(molq_species_model(sp[i])));
            return EXIT_DATA;
        }
        if (st == MOLQ_EARG) {
            fprintf(stderr, "molq: species '%s': no spin conversion "
                    "enthalpy; the library gives it for diatomic level sums "
                    "(diatomic_states) only\n", molq_species_name(sp[i]));
            return EXIT_DATA;
        }
        if (st != MOLQ_OK) {
            eval_error(sp[i], Tmin, 0.0, st);
            return EXIT_DATA;
        }
    }

    if (o->format == FMT_JSON) {
        jctx j = {0};
        json_t *root = jcheck(&j, json_object());
        json_t *units = jcheck(&j, json_object()), *list;
        jset(&j, units, "T", json_string("K"));
        jset(&j, units, SPIN_COLUMN, json_string(unit));
        jset(&j, units, "molar_mass", json_string("g/mol"));
        jset(&j, root, "units", units);
        jset(&j, root, "basis", json_string(o->per_mass ? "mass" : "molar"));
        list = jcheck(&j, json_array());
        jset(&j, root, "species", list);
        for (i = 0; i < nsp && !j.failed; i++) {
            json_t *e = jcheck(&j, json_object()), *rows;
            jappend(&j, list, e);
            jset(&j, e, "name", json_string(molq_species_name(sp[i])));
            json_models(&j, e, sp[i], asked[i]);
            jset(&j, e, "molar_mass",
                 json_real(molq_species_molar_mass(sp[i]) * 1e3));
            rows = jcheck(&j, json_array());
            jset(&j, e, "rows", rows);
            for (t = 0; t < o->nT && !j.failed; t++) {
                json_t *r;
                if ((st = spin_value(sp[i], o->T[t], o->per_mass, &v)) !=
                    MOLQ_OK) {
                    eval_error(sp[i], o->T[t], 0.0, st);
                    json_decref(root);
                    return EXIT_DATA;
                }
                r = jcheck(&j, json_object());
                jappend(&j, rows, r);
                jset(&j, r, "T", json_real(o->T[t]));
                jset(&j, r, SPIN_COLUMN, json_real(v));
            }
        }
        return json_finish(&j, root);
    }

    if (o->format == FMT_CSV)
        puts(show_models(o) ? "species,model,model_used,T," SPIN_COLUMN
                            : "species,T," SPIN_COLUMN);
    else
        printf("molq ortho-para (even/odd-J) conversion enthalpy "
               "h_frozen - h_equilibrium, per %s\n"
               "(heat released when the frozen even/odd mixture relaxes to "
               "spin equilibrium at T)\n",
               o->per_mass ? "kilogram" : "mole");
    for (i = 0; i < nsp; i++) {
        if (o->format == FMT_TEXT) {
            printf("\n");
            text_species_title(sp[i], 1, asked[i]);
            printf("%*s%*s\n%*s%*s\n", TW, "T", 2 * TW, SPIN_COLUMN, TW, "K",
                   2 * TW, unit);
        }
        for (t = 0; t < o->nT; t++) {
            if ((st = spin_value(sp[i], o->T[t], o->per_mass, &v)) !=
                MOLQ_OK) {
                fflush(stdout);
                eval_error(sp[i], o->T[t], 0.0, st);
                return EXIT_DATA;
            }
            if (o->format == FMT_CSV) {
                csv_field(molq_species_name(sp[i]));
                csv_models(sp[i], asked[i], o);
                putchar(',');
                csv_number(o->T[t]);
                putchar(',');
                csv_number(v);
                putchar('\n');
            } else {
                printf("%*.8g %*.7g\n", TW, o->T[t], 2 * TW - 1, v);
            }
        }
    }
    return 0;
}

/* ------------------------------------------------------------------------ */
/* molq list                                                                */
/* ------------------------------------------------------------------------ */

/* Longest source summary of `molq list`, in characters (code points). */
#define SUMMARY_MAX 60

/* The one-line source summary of `molq list` (text, csv source_summary,
 * json "source_summary"), the rule README.md "Command-line tool" states:
 * - the first clause of the source: the text before its first ';' that
 *   is outside parentheses and brackets (a ';' inside "(...)" does not
 *   end it);
 * - every run of ASCII white space and control characters (bytes up to
 *   0x20, and 0x7f) becomes one space,
 *   and leading and trailing spaces go;
 * - a clause of more than SUMMARY_MAX characters (UTF-8 code points) is
 *   cut at the last space within its first SUMMARY_MAX - 3 characters
 *   (at that length when there is none), trailing spaces, commas and
 *   colons are dropped and "..." is appended, so the summary has at most
 *   SUMMARY_MAX characters and never splits a character.
 * `buf` needs 4 * SUMMARY_MAX + 1 bytes; "" for an empty source. */
static void source_summary(const char *src, char *buf, size_t len)
{
    size_t n = 0, cps = 0, cut = 0, i;
    int depth = 0, space = 0, over = 0;
    const unsigned char *p;
    for (p = (const unsigned char *)src; *p != '\0' && !over; p++) {
        unsigned char c = *p;
        if (c == '(' || c == '[')
            depth++;
        else if ((c == ')' || c == ']') && depth > 0)
            depth--;
        else if (c == ';' && depth == 0)
            break;
        if (c <= ' ' || c == 0x7f) {
            space = 1;
            continue;
        }
        /* Emit a pending space, then c; both start a code point, except a
         * UTF-8 continuation byte. */
        for (i = (space && n > 0) ? 0 : 1; i < 2; i++) {
            unsigned char b = i == 0 ? ' ' : c;
            if ((b & 0xC0) != 0x80) {
                if (cps == SUMMARY_MAX - 3)
                    cut = n;
                if (cps == SUMMARY_MAX) {
                    over = 1;
                    break;
                }
                cps++;
            }
            if (n + 4 >= len) { /* cannot happen with valid UTF-8 */
                over = 1;
                break;
            }
            buf[n++] = (char)b;
        }
        space = 0;
    }
    if (over) {
        size_t end = cut;
        for (i = cut; i > 0; i--)
            if (buf[i - 1] == ' ') {
                end = i - 1;
                break;
            }
        while (end > 0 && (buf[end - 1] == ' ' || buf[end - 1] == ',' ||
                           buf[end - 1] == ':'))
            end--;
        memcpy(buf + end, "...", 3);
        n = end + 3;
    }
    buf[n] = '\0';
}

typedef struct entry {
    const molq_species *sp;
    const char *set; /* "file", "built-in" or "built-in (hidden by file)" */
    char summary[4 * SUMMARY_MAX + 1];
    char range[64]; /* "100-6000" (K), "-" when the data state none */
    int has_range;
    double t_low, t_high;
} entry;

static int cmd_list(const options *o, const sets *s)
{
    size_t nu = molq_db_count(s->user), nb = molq_db_count(s->builtin);
    size_t n = 0, i, wn = 4, wf = 7, ws = 3, wm = 5, wr = 11;
    entry *e = malloc((nu + nb + 1) * sizeof *e);
    const molq_species *dummy;
    int rc = 0;
    if (e == NULL) {
        fputs("molq: out of memory\n", stderr);
        return EXIT_DATA;
    }
    for (i = 0; i < nu; i++) {
        e[n].sp = molq_db_species(s->user, i);
        e[n++].set = "file";
    }
    for (i = 0; i < nb; i++) {
        e[n].sp = molq_db_species(s->builtin, i);
        e[n].set = (s->user != NULL &&
                    molq_db_find(s->user, molq_species_name(e[n].sp),
                                 &dummy) == MOLQ_OK)
                       ? "built-in (hidden by file)"
                       : "built-in";
        n++;
    }
    for (i = 0; i < n; i++) {
        source_summary(molq_species_source(e[i].sp), e[i].summary,
                       sizeof e[i].summary);
        e[i].has_range = molq_species_validated_range(
                             e[i].sp, &e[i].t_low, &e[i].t_high) == MOLQ_OK;
        if (e[i].has_range)
            snprintf(e[i].range, sizeof e[i].range, "%.10g-%.10g",
                     e[i].t_low, e[i].t_high);
        else
            snprintf(e[i].range, sizeof e[i].range, "-");
    }

    if (o->format == FMT_JSON) {
        jctx j = {0};
        json_t *root = jcheck(&j, json_object()), *list;
        json_t *units = jcheck(&j, json_object());
        jset(&j, units, "molar_mass", json_string("g/mol"));
        jset(&j, units, "charge", json_string("e"));
        jset(&j, units, "validated_range", json_string("K"));
        jset(&j, root, "units", units);
        list = jcheck(&j, json_array());
        jset(&j, root, "species", list);
        for (i = 0; i < n && !j.failed; i++) {
            json_t *x = jcheck(&j, json_object());
            jappend(&j, list, x);
            jset(&j, x, "name", json_string(molq_species_name(e[i].sp)));
            jset(&j, x, "formula", json_string(molq_species_formula(e[i].sp)));
            jset(&j, x, "charge",
                 json_integer(molq_species_charge(e[i].sp)));
            jset(&j, x, "structure", json_string(structure_of(e[i].sp)));
            jset(&j, x, "model",
                 json_string(model_name(molq_species_model(e[i].sp))));
            jset(&j, x, "molar_mass",
                 json_real(molq_species_molar_mass_g_per_mol(e[i].sp)));
            jset(&j, x, "has_formation_enthalpy",
                 json_boolean(molq_species_has_formation_enthalpy(e[i].sp)));
            if (e[i].has_range) {
                json_t *r = jcheck(&j, json_array());
                jappend(&j, r, json_real(e[i].t_low));
                jappend(&j, r, json_real(e[i].t_high));
                jset(&j, x, "validated_range", r);
            } else {
                jset(&j, x, "validated_range", json_null());
            }
            jset(&j, x, "set", json_string(e[i].set));
            jset(&j, x, "source_summary", json_string(e[i].summary));
            jset(&j, x, "source", json_string(molq_species_source(e[i].sp)));
        }
        free(e);
        return json_finish(&j, root);
    }
    if (o->format == FMT_CSV) {
        puts("name,formula,charge,structure,model,molar_mass,"
             "formation_enthalpy,t_low,t_high,set,source_summary,source");
        for (i = 0; i < n; i++) {
            csv_field(molq_species_name(e[i].sp));
            putchar(',');
            csv_field(molq_species_formula(e[i].sp));
            printf(",%d,%s,%s,", molq_species_charge(e[i].sp),
                   structure_of(e[i].sp),
                   model_name(molq_species_model(e[i].sp)));
            csv_number(molq_species_molar_mass_g_per_mol(e[i].sp));
            printf(",%s,", molq_species_has_formation_enthalpy(e[i].sp)
                               ? "yes"
                               : "no");
            if (e[i].has_range) {
                csv_number(e[i].t_low);
                putchar(',');
                csv_number(e[i].t_high);
            } else {
                putchar(','); /* both empty: the data state no range */
            }
            putchar(',');
            csv_field(e[i].set);
            putchar(',');
            csv_field(e[i].summary);
            putchar(',');
            csv_field(molq_species_source(e[i].sp));
            putchar('\n');
        }
        free(e);
        return rc;
    }
    for (i = 0; i < n; i++) {
        size_t a = strlen(molq_species_name(e[i].sp));
        size_t b = strlen(molq_species_formula(e[i].sp));
        size_t c = strlen(e[i].set);
        size_t d = strlen(model_name(molq_species_model(e[i].sp)));
        size_t r = strlen(e[i].range);
        wm = d > wm ? d : wm;
        wn = a > wn ? a : wn;
        wf = b > wf ? b : wf;
        ws = c > ws ? c : ws;
        wr = r > wr ? r : wr;
    }
    if (wn > 40)
        wn = 40;
    if (wf > 40)
        wf = 40;
    printf("%-*s  %-*s  %6s  %-9s  %-*s  %12s  %-4s  %-*s  %-*s  %s\n",
           (int)wn, "name", (int)wf, "formula", "charge", "structure",
           (int)wm, "model", "M g/mol", "dfH", (int)wr, "validated K",
           (int)ws, "set", "source (first clause)");
    for (i = 0; i < n; i++) {
        int q = molq_species_charge(e[i].sp);
        char charge[16];
        snprintf(charge, sizeof charge, q != 0 ? "%+d" : "%d", q);
        printf("%-*s  %-*s  %6s  %-9s  %-*s  %12.8g  %-4s  %-*s  %-*s  %s\n",
               (int)wn, molq_species_name(e[i].sp), (int)wf,
               molq_species_formula(e[i].sp), charge, structure_of(e[i].sp),
               (int)wm, model_name(molq_species_model(e[i].sp)),
               molq_species_molar_mass_g_per_mol(e[i].sp),
               molq_species_has_formation_enthalpy(e[i].sp) ? "yes" : "no",
               (int)wr, e[i].range, (int)ws, e[i].set, e[i].summary);
    }
    if (s->path != NULL)
        printf("\n'file' species come from %s; names are looked up there "
               "first.\n", s->path);
    free(e);
    return rc;
}

/* molq show: one block (text) or object (json) per species. */
static int cmd_show(const options *o, const molq_species *const *sp,
                    size_t n)
{
    size_t i, k;
    if (o->format == FMT_JSON) {
        jctx j = {0};
        json_t *root = jcheck(&j, json_object()), *list;
        list = jcheck(&j, json_array());
        jset(&j, root, "species", list);
        for (i = 0; i < n && !j.failed; i++) {
            json_t *x = jcheck(&j, json_object());
            json_t *el = jcheck(&j, json_object());
            json_t *modes = jcheck(&j, json_array());
            json_t *warn = jcheck(&j, json_array());
            double lo, hi;
            jappend(&j, list, x);
            jset(&j, x, "name", json_string(molq_species_name(sp[i])));
            jset(&j, x, "formula", json_string(molq_species_formula(sp[i])));
            for (k = 0; k < molq_species_element_count(sp[i]); k++) {
                const char *sym;
                long cnt;
                if (molq_species_element(sp[i], k, &sym, &cnt) == MOLQ_OK)
                    jset(&j, el, sym, json_integer(cnt));
            }
            jset(&j, x, "elements", el);
            jset(&j, x, "charge", json_integer(molq_species_charge(sp[i])));
            jset(&j, x, "structure", json_string(structure_of(sp[i])));
            jset(&j, x, "model",
                 json_string(model_name(molq_species_model(sp[i]))));
            jset(&j, x, "molar_mass",
                 json_real(molq_species_molar_mass_g_per_mol(sp[i])));
            if (molq_species_has_formation_enthalpy(sp[i]) &&
                molq_eval(sp[i], 298.15, MOLQ_P_STANDARD, MOLQ_H, &lo) ==
                    MOLQ_OK) /* h(298.15 K) is dfH (molq.h) */
                jset(&j, x, "formation_enthalpy_298", json_real(lo));
            jset(&j, x, "t_min", json_real(molq_species_t_min(sp[i])));
            if (molq_species_validated_range(sp[i], &lo, &hi) == MOLQ_OK) {
                json_t *r = jcheck(&j, json_array());
                jappend(&j, r, json_real(lo));
                jappend(&j, r, json_real(hi));
                jset(&j, x, "validated_range", r);
            }
            for (k = 0; k < molq_species_mode_count(sp[i]); k++) {
                molq_mode_kind kind;
                if (molq_species_mode_kind(sp[i], k, &kind) == MOLQ_OK)
                    jappend(&j, modes, json_string(molq_mode_kind_name(kind)));
            }
            jset(&j, x, "modes", modes);
            jset(&j, x, "source", json_string(molq_species_source(sp[i])));
            for (k = 0; k < molq_species_warning_count(sp[i]); k++)
                jappend(&j, warn, json_string(molq_species_warning(sp[i], k)));
            jset(&j, x, "warnings", warn);
        }
        return json_finish(&j, root);
    }
    for (i = 0; i < n; i++) {
        double lo, hi;
        size_t nw = molq_species_warning_count(sp[i]);
        printf("%s%s\n", i ? "\n" : "", molq_species_name(sp[i]));
        printf("  formula           %s\n", molq_species_formula(sp[i]));
        printf("  elements          ");
        for (k = 0; k < molq_species_element_count(sp[i]); k++) {
            const char *sym;
            long cnt;
            if (molq_species_element(sp[i], k, &sym, &cnt) == MOLQ_OK)
                printf("%s%s %ld", k ? ", " : "", sym, cnt);
        }
        printf("%s\n", molq_species_element_count(sp[i]) ? "" : "(none)");
        if (molq_species_charge(sp[i]) != 0)
            printf("  charge            %+d\n", molq_species_charge(sp[i]));
        else
            printf("  charge            0\n");
        printf("  structure         %s\n", structure_of(sp[i]));
        printf("  model             %s\n",
               model_name(molq_species_model(sp[i])));
        printf("  molar mass        %.10g g/mol\n",
               molq_species_molar_mass_g_per_mol(sp[i]));
        if (molq_species_has_formation_enthalpy(sp[i]) &&
            molq_eval(sp[i], 298.15, MOLQ_P_STANDARD, MOLQ_H, &lo) == MOLQ_OK)
            printf("  dfH(298.15 K)     %.10g J/mol\n", lo); /* = h(298.15) */
        else if (molq_species_has_formation_enthalpy(sp[i]))
            printf("  dfH(298.15 K)     (given; 298.15 K is below t_min)\n");
        else
            printf("  dfH(298.15 K)     (none: h is H(T) - H(298.15 K))\n");
        printf("  t_min             %.6g K\n", molq_species_t_min(sp[i]));
        if (molq_species_validated_range(sp[i], &lo, &hi) == MOLQ_OK)
            printf("  validated range   %g K to %g K\n", lo, hi);
        else
            printf("  validated range   (not stated by the data)\n");
        printf("  modes             ");
        for (k = 0; k < molq_species_mode_count(sp[i]); k++) {
            molq_mode_kind kind;
            if (molq_species_mode_kind(sp[i], k, &kind) == MOLQ_OK)
                printf("%s%s", k ? ", " : "", molq_mode_kind_name(kind));
        }
        printf("\n  source            %s\n", molq_species_source(sp[i]));
        /* The checks are the library's (molq.h, molq_species_warning_count);
         * each finding is one warning naming the field. */
        if (nw == 0)
            printf("  data checks       no warnings from the checks that apply "
                   "(molar mass\n"
                   "                    against the formula; for diatomic "
                   "states the\n"
                   "                    plausibility of De, alpha_e, "
                   "we^2/(4 wexe), Be against\n"
                   "                    re, D0 against the atoms' formation "
                   "enthalpies)\n");
        for (k = 0; k < nw; k++)
            printf("  %s %s\n", k ? "                 " : "warning          ",
                   molq_species_warning(sp[i], k));
    }
    return 0;
}

/* ------------------------------------------------------------------------ */
/* main                                                                     */
/* ------------------------------------------------------------------------ */

static int finish_output(int rc)
{
    if (fflush(stdout) != 0 || ferror(stdout)) {
        fputs("molq: error writing the output\n", stderr);
        return rc != 0 ? rc : EXIT_DATA;
    }
    return rc;
}

/* The species `base` with model_table entry `m` (-1: its own model):
 * `base` itself when it already uses that model, else a new species stored
 * in *owned (the caller frees it).  An atom without data for model `m`
 * keeps its own model, with a note on stderr.  @return NULL after printing
 * an error. */
static const molq_species *with_model(const molq_species *base, int m,
                                      molq_species **owned)
{
    char err[1024];
    molq_status st;
    *owned = NULL;
    if (m < 0 || molq_species_model(base) == model_table[m].id)
        return base;
    st = molq_species_with_model(base, model_table[m].id, owned, err,
                                 sizeof err);
    if (st != MOLQ_OK && molq_species_structure(base) == MOLQ_ATOM) {
        /* An atom is translation and electronic levels in every model: its
         * own model gives the same physics.  Use it and say so (the output
         * carries model_used). */
        fprintf(stderr, "molq: note: %s has no %s model; using %s\n",
                molq_species_name(base), model_name(model_table[m].id),
                model_name(molq_species_model(base)));
        *owned = NULL;
        return base;
    }
    if (st != MOLQ_OK) {
        fprintf(stderr, "molq: species '%s' cannot use model '%s': %s (%s)\n",
                molq_species_name(base), model_name(model_table[m].id), err,
                molq_status_string(st));
        *owned = NULL;
        return NULL;
    }
    return *owned;
}

int main(int argc, char **argv)
{
    options o;
    sets s = {NULL, NULL, NULL};
    const molq_species **sp = NULL; /* nvar species to evaluate */
    molq_species **owned = NULL;    /* those made here with another model */
    const char **asked = NULL;      /* model asked for each, NULL: own */
    size_t nvar = 0, nm = 1;
    int cmd, rc;
    size_t i, k;

    if (argc < 2) {
        print_help(stderr);
        return EXIT_USAGE;
    }
    if (strcmp(argv[1], "--help") == 0 || strcmp(argv[1], "-h") == 0 ||
        strcmp(argv[1], "help") == 0) {
        if (strcmp(argv[1], "help") == 0 && argc > 3) {
            usage_error("'molq help' takes one command name (got '%s' "
                        "after '%s')", argv[3], argv[2]);
            return EXIT_USAGE;
        }
        if (strcmp(argv[1], "help") == 0 && argc > 2 &&
            strcmp(argv[2], "help") != 0) {
            cmd = find_command(argv[2]);
            if (cmd == N_CMDS) {
                usage_error("help: unknown command '%s' (nearest: '%s'; the "
                            "commands are table, modes, spin, list (or "
                            "species) and show)",
                            argv[2], nearest_command(argv[2]));
                return EXIT_USAGE;
            }
            print_command_help(stdout, cmd);
            return finish_output(0);
        }
        print_help(stdout);
        return finish_output(0);
    }
    if (strcmp(argv[1], "--version") == 0) {
        printf("molq %s (libmolq %s)\n", MOLQ_VERSION_STRING,
               molq_version_string());
        return finish_output(0);
    }
    cmd = find_command(argv[1]);
    if (cmd == N_CMDS) {
        if (argv[1][0] == '-')
            usage_error("unknown option '%s'%s", argv[1], "");
        else
            usage_error("unknown command '%s' (nearest: '%s'; use table, "
                        "modes, spin, list or species, show or help)",
                        argv[1], nearest_command(argv[1]));
        return EXIT_USAGE;
    }

    memset(&o, 0, sizeof o);
    o.cmd = cmd;
    o.word = argv[1];
    o.p = MOLQ_P_STANDARD;
    o.format = FMT_TEXT;
    o.model = -1;
    rc = parse_options(cmd, argc - 2, argv + 2, &o);
    if (rc != 0)
        goto out;
    if (o.help) {
        print_command_help(stdout, cmd);
        rc = finish_output(0);
        goto out;
    }
    if (!o.T_owned && cmd == CMD_SPIN) {
        o.T = (double *)default_T_spin;
        o.nT = sizeof default_T_spin / sizeof default_T_spin[0];
    } else if (!o.T_owned) {
        o.T = (double *)default_T;
        o.nT = sizeof default_T / sizeof default_T[0];
    }
    if ((rc = load_sets(o.data_path, &s)) != 0)
        goto out;
    if (cmd == CMD_LIST) {
        rc = finish_output(cmd_list(&o, &s));
        goto out;
    }
    /* Every species with each model asked for, species-major. */
    if (o.ncompare > 0)
        nm = o.ncompare;
    nvar = o.nnames * nm;
    sp = malloc(nvar * sizeof *sp);
    owned = calloc(nvar, sizeof *owned);
    asked = calloc(nvar, sizeof *asked);
    if (sp == NULL || owned == NULL || asked == NULL) {
        fputs("molq: out of memory\n", stderr);
        rc = EXIT_DATA;
        goto out;
    }
    for (i = 0; i < o.nnames; i++) {
        const molq_species *base = find_species(&s, o.names[i]);
        if (base == NULL) {
            rc = EXIT_DATA;
            goto out;
        }
        for (k = 0; k < nm; k++) {
            int m = o.ncompare > 0 ? (int)o.compare[k] : o.model;
            sp[i * nm + k] = with_model(base, m, &owned[i * nm + k]);
            asked[i * nm + k] = m >= 0 ? model_name(model_table[m].id) : NULL;
            if (sp[i * nm + k] == NULL) {
                rc = EXIT_DATA;
                goto out;
            }
        }
    }
    if (cmd == CMD_SHOW)
        rc = cmd_show(&o, sp, o.nnames);
    else if (cmd == CMD_TABLE)
        rc = cmd_table(&o, sp, asked, o.nnames, nm, o.ncompare > 0);
    else if (cmd == CMD_MODES)
        rc = cmd_modes(&o, sp, asked, o.nnames);
    else
        rc = cmd_spin(&o, sp, asked, o.nnames);
    rc = finish_output(rc);
out:
    if (owned != NULL)
        for (i = 0; i < nvar; i++)
            molq_species_free(owned[i]);
    free(owned);
    free(asked);
    free(sp);
    free(o.names);
    if (o.T_owned)
        free(o.T);
    free_sets(&s);
    return rc;
}
