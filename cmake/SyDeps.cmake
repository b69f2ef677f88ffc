# Collects every dependency into SY_DEP_TARGETS; one file per dependency below.
find_package(PkgConfig REQUIRED)
set(SY_DEP_TARGETS)
include(SyGSL)
include(SyLapacke)
include(SyNetCDF)
include(SyCsv)
include(SyInih)
include(SyJansson)
include(SyArb)
include(SyPLplot)
include(SyOpenMP)
include(SyCmplx)   # not a library: C11 CMPLX where the C library lacks it for this compiler
