/* Spectral moments of a sampled spectrum and the periods built on them (references.md
 * 2.2): m_n = sum omega_i^n S_i dOmega_i (n = -2..2, mid-point cells of grid.c),
 * Hm0 = 4 sqrt(m0), Te = m_-1/m_0, T1 = m_0/m_1, Tz = sqrt(m_0/m_2) (frequency moments;
 * in angular moments each carries 2 pi), eps0 = sqrt(m_0 m_-2 / m_-1^2 - 1). SI units. */
#include <complex.h>
#include "sea_impl.h"

#include <math.h>

static void finish(sy_sea_moments *out)
{
    const double *m = out->m;
    for (int n = -2; n <= 2; n++)
        out->mf[n + 2] = m[n + 2] * pow(2.0 * SYI_PI, -n);
    out->hm0 = 4.0 * sqrt(m[2]);
    out->te = 2.0 * SYI_PI * m[1] / m[2];
    out->t1 = 2.0 * SYI_PI * m[2] / m[3];
    out->tz = 2.0 * SYI_PI * sqrt(m[2] / m[4]);
    out->eps0 = sqrt(fmax(0.0, m[2] * m[0] / (m[1] * m[1]) - 1.0));
}

int sy_sea_moments_sampled(const double *omega, const double *S, size_t n, sy_sea_moments *out,
                           sy_error *err)
{
    if (S == NULL || out == NULL)
        return sy_error_set(err, SY_EINVAL, "sea: spectrum samples or moments record is NULL");
    int rc = syi_sea_check_grid(omega, n, "omega", err);
    if (rc != SY_OK)
        return rc;
    double m[5] = {0};
    for (size_t i = 0; i < n; i++) {
        if (!(S[i] >= 0.0) || !isfinite(S[i]))
            return sy_error_set(err, SY_EINPUT,
                                "sea: spectral density must be finite and >= 0 m^2 s/rad, got "
                                "S[%zu] = %g at omega %g rad/s",
                                i, S[i], omega[i]);
        double a, b, w = omega[i];
        syi_sea_cell(omega, n, i, &a, &b);
        double e = S[i] * (b - a);
        m[0] += e / (w * w);
        m[1] += e / w;
        m[2] += e;
        m[3] += e * w;
        m[4] += e * w * w;
    }
    if (!(m[2] > 0.0))
        return sy_error_set(err, SY_EINPUT, "sea: sampled spectrum has no energy (m0 = %g m^2)",
                            m[2]);
    for (int j = 0; j < 5; j++)
        out->m[j] = m[j];
    finish(out);
    return SY_OK;
}
