# LAPACKE (C interface to LAPACK) on OpenBLAS: dense LU for the interaction systems.
include(SyLib)
sy_find_pc(LAPACKE lapacke liblapacke-dev)
sy_find_pc(OPENBLAS openblas libopenblas-dev)
