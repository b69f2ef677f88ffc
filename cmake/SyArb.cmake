# FLINT/Arb: complex-argument Bessel functions for complex frequencies (src/special only).
include(SyLib)
sy_find_plain(ARB acb_hypgeom.h libflint-arb-dev flint-arb flint)
