// A shared library named like a plug-in but without the entry point.
extern "C" int armature_unrelated_symbol() { return 42; }
