# jansson: the machine-readable summary.json.
include(SyLib)
sy_find_pc(JANSSON jansson libjansson-dev)
