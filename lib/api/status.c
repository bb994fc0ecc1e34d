/* Version, status strings and property names: static tables only. */
#include <string.h>

#include "molq/molq.h"

unsigned molq_version_number(void)
{
    return MOLQ_VERSION_NUMBER;
}

const char *molq_version_string(void)
{
    return MOLQ_VERSION_STRING;
}

const char *molq_status_string(molq_status status)
{
    static const char *const text[] = {
        "success",
        "invalid argument",
        "out of memory",
        "file could not be read",
        "malformed JSON",
        "unknown or missing key",
        "value of the wrong type",
        "value out of its allowed range",
        "duplicate species name",
        "species not found",
        "temperature or pressure not finite and positive",
        "temperature outside the validity range of a model",
        "input exceeds a size limit",
        "iteration did not converge",
    };
    if ((int)status < 0 || (size_t)status >= sizeof text / sizeof text[0])
        return "unknown status";
    return text[status];
}

static const struct {
    const char *name, *unit;
} props[] = {
    {"lnq", "1"},
    {"cp", "J/(mol K)"},
    {"cv", "J/(mol K)"},
    {"h", "J/mol"},
    {"u", "J/mol"},
    {"s", "J/(mol K)"},
    {"g", "J/mol"},
    {"a", "J/mol"},
    {"h_minus_h298", "J/mol"},
    {"gef", "J/(mol K)"},
    {"h_minus_h0", "J/mol"},
    {"dcp_dT", "J/(mol K^2)"},
    {"dcv_dT", "J/(mol K^2)"},
    {"ds_dT", "J/(mol K^2)"},
    {"dh_dT", "J/(mol K)"},
    {"dgRT_dT", "1/K"},
};

#define NPROPS (sizeof props / sizeof props[0])

size_t molq_property_count(void)
{
    return NPROPS;
}

const char *molq_property_name(molq_property p)
{
    return ((int)p < 0 || (size_t)p >= NPROPS) ? NULL : props[p].name;
}

const char *molq_property_unit(molq_property p)
{
    return ((int)p < 0 || (size_t)p >= NPROPS) ? NULL : props[p].unit;
}

molq_status molq_property_from_name(const char *name, molq_property *out)
{
    size_t i;
    if (name == NULL || out == NULL)
        return MOLQ_EARG;
    for (i = 0; i < NPROPS; i++)
        if (strcmp(props[i].name, name) == 0) {
            *out = (molq_property)i;
            return MOLQ_OK;
        }
    return MOLQ_ENOTFOUND;
}

static const char *const mode_names[] = {"translation", "rotation",
                                         "vibration", "electronic",
                                         "rovibronic", "torsion"};

const char *molq_mode_kind_name(molq_mode_kind kind)
{
    if ((int)kind < 0 ||
        (size_t)kind >= sizeof mode_names / sizeof mode_names[0])
        return NULL;
    return mode_names[kind];
}

static const char *const model_names[] = {"rrho", "levels"};
#define NMODELS (sizeof model_names / sizeof model_names[0])

size_t molq_model_count(void)
{
    return NMODELS;
}

const char *molq_model_name(molq_model model)
{
    return ((int)model < 0 || (size_t)model >= NMODELS) ? NULL
                                                        : model_names[model];
}

molq_status molq_model_from_name(const char *name, molq_model *out)
{
    size_t i;
    if (name == NULL || out == NULL)
        return MOLQ_EARG;
    for (i = 0; i < NMODELS; i++)
        if (strcmp(model_names[i], name) == 0) {
            *out = (molq_model)i;
            return MOLQ_OK;
        }
    return MOLQ_ENOTFOUND;
}
