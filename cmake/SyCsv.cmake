# libcsv: RFC 4180 CSV parsing for layouts and scatter tables (no pkg-config file on Debian).
include(SyLib)
sy_find_plain(CSV csv.h libcsv-dev csv)
