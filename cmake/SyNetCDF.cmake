# NetCDF-C: climate tables, hindcasts, hydrodynamic database, power matrices.
include(SyLib)
sy_find_pc(NETCDF netcdf libnetcdf-dev)
