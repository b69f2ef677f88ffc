# GNU Scientific Library: real special functions, quadrature, minimisers, root finders.
include(SyLib)
sy_find_pc(GSL gsl libgsl-dev)
