# C11's CMPLX(x, y) from <complex.h>. glibc (2.36, Debian 12) defines it only for GCC >= 4.7
# (it tests __GNUC_PREREQ, and clang reports itself as GCC 4.2), so under clang the
# library's CMPLX calls become implicit function declarations and fail to link. When the
# C library's <complex.h> lacks a working CMPLX, every file is compiled with
# cmake/sy_cmplx.h forced in first, which defines it on the compiler's __builtin_complex
# (the same definition glibc gives GCC). Compilers whose C library has CMPLX see no change.
include(CheckCSourceCompiles)
set(CMAKE_REQUIRED_DEFINITIONS -D_XOPEN_SOURCE=700)
check_c_source_compiles([=[
#include <complex.h>
int main(void)
{
    double complex z = CMPLX(1.0, 2.0);
    return (int)cimag(z) - 2;
}]=] SY_LIBC_HAS_CMPLX)
unset(CMAKE_REQUIRED_DEFINITIONS)
if(NOT SY_LIBC_HAS_CMPLX)
  message(STATUS "swellyield: <complex.h> has no CMPLX for this compiler; using cmake/sy_cmplx.h")
  add_compile_options(-include ${CMAKE_CURRENT_LIST_DIR}/sy_cmplx.h)
endif()
