/* swellyield umbrella header: includes every public module header. */
#ifndef SWELLYIELD_H
#define SWELLYIELD_H
#include "swellyield/core.h"
#include "swellyield/waves.h"
#include "swellyield/sea.h"
#include "swellyield/climate.h"
#include "swellyield/special.h"
#include "swellyield/body.h"
#include "swellyield/array.h"
#include "swellyield/model.h"
#include "swellyield/hydrodb.h"
#include "swellyield/dynamics.h"
#include "swellyield/yield.h"
#include "swellyield/outputs.h"
#include "swellyield/hydro.h"
#include "swellyield/poles.h"
#include "swellyield/plot.h"
#include "swellyield/response.h"
#endif
