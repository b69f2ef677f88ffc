/* swellyield umbrella header: includes every public module header. */
#ifndef SWELLYIELD_H
#define SWELLYIELD_H
#include "swellyield/core.h"
#endif
