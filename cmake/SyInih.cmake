# libinih: the project (INI) file parser.
include(SyLib)
sy_find_pc(INIH inih libinih-dev)
