/* Private to the model module. */
#ifndef SY_MODEL_IMPL_H
#define SY_MODEL_IMPL_H

#include "swellyield/model.h"

/* Read the [layout] CSV into model->devices, applying [device]/[pto] defaults and
 * checking names, numbers, duplicates and overlaps. "FILE:LINE: message" errors. */
int syi_model_read_layout(sy_model *model, sy_error *err);

#endif
