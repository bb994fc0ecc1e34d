// The public header compiled as C++ with -Wall -Wextra -Werror.
#include <molq/molq.h>

int main()
{
    molq_status st = MOLQ_OK;
    return molq_status_string(st) == nullptr;
}
