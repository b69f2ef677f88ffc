/* Shared by the program's verb files. The program uses the public API only. */
#ifndef SY_CLI_H
#define SY_CLI_H

#include "swellyield/swellyield.h"

enum { SY_EXIT_OK = 0, SY_EXIT_FAIL = 1, SY_EXIT_USAGE = 2 };

typedef struct sy_cli_verb {
    const char *name;
    const char *summary;
    int (*run)(int argc, char **argv); /* argv[0] is the verb */
} sy_cli_verb;

int sy_cmd_version(int argc, char **argv);

#endif
