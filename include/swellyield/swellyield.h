/* swellyield umbrella header: includes every public module header. */
#ifndef SWELLYIELD_H
#define SWELLYIELD_H
#include "swellyield/core.h"
#include "swellyield/waves.h"
#include "swellyield/special.h"
#include "swellyield/body.h"
#include "swellyield/array.h"
#endif
