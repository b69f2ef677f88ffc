# PLplot with its cairo driver (plplot-driver-cairo): the run's pictures (src/plot).
include(SyLib)
sy_find_pc(PLPLOT plplot "libplplot-dev plplot-driver-cairo")
