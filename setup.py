"""Builds the C++ kernel, the code plug-ins and the binding with CMake and
places them inside the `armature` package:

    armature/_core*.so                     the binding (RPATH $ORIGIN/lib)
    armature/lib/libarmature.so*           the kernel
    armature/lib/armature/codes/...        the plug-ins and their data

The kernel finds its plug-ins beside itself, so no environment variable is
needed after installation.
"""
import pathlib
import shutil
import subprocess
import sys

from setuptools import Extension, setup
from setuptools.command.build_ext import build_ext

ROOT = pathlib.Path(__file__).resolve().parent


class CMakeBuild(build_ext):
    def build_extension(self, ext):
        build = pathlib.Path(self.build_temp).resolve() / "cmake"
        subprocess.run(["cmake", "-S", str(ROOT), "-B", str(build), "-DCMAKE_BUILD_TYPE=Release",
                        "-DARMATURE_TESTS=OFF", "-DARMATURE_PYTHON_PACKAGE_RPATH=ON",
                        f"-DPython3_EXECUTABLE={sys.executable}"], check=True)
        subprocess.run(["cmake", "--build", str(build), "-j2"], check=True)
        package = pathlib.Path(self.get_ext_fullpath(ext.name)).resolve().parent
        package.mkdir(parents=True, exist_ok=True)
        for module in (build / "python" / "armature").glob("_core*.so"):
            shutil.copy2(module, package / module.name)
        lib = package / "lib"
        if lib.exists():
            shutil.rmtree(lib)
        shutil.copytree(build / "lib", lib, symlinks=True)


setup(ext_modules=[Extension("armature._core", sources=[])], cmdclass={"build_ext": CMakeBuild})
