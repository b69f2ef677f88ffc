/* swellyield version: the program and dependency versions. */
#include "cli.h"

#include <stdio.h>

int sy_cmd_version(int argc, char **argv)
{
    (void)argc;
    (void)argv;
    printf("swellyield %s\n%s\n", sy_version(), sy_dependency_versions());
    return SY_EXIT_OK;
}
