/* Compiled as C89, C99 and C11 with -Wall -Wextra -Werror -pedantic: the
 * public header must stay usable from any C dialect a host uses. */
#include <molq/molq.h>

int main(void)
{
    molq_property p = MOLQ_CP;
    return molq_property_name(p) == 0;
}
