/* Forced into every file (-include) only when the C library's <complex.h> has no CMPLX
 * for this compiler (cmake/SyCmplx.cmake): glibc 2.36 defines it for GCC >= 4.7 only, not
 * for clang. The definition is glibc's own for GCC. CMPLX(x, y) must not be written as
 * x + y * I: that gives NaN for an infinite y and the wrong sign of zero. */
#ifndef SY_CMPLX_H
#define SY_CMPLX_H
#if defined(__has_builtin)
#if __has_builtin(__builtin_complex)
#define CMPLX(x, y) __builtin_complex((double)(x), (double)(y))
#endif
#endif
#ifndef CMPLX
#error "no CMPLX in <complex.h> and no __builtin_complex: use a C11 compiler with CMPLX"
#endif
#endif
