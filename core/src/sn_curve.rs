//! The stress-life (S–N) line: the fully reversed amplitude σar a part survives for N cycles,
//! as Basquin's straight line on log-log axes, σar = a·N^b.
//!
//! Sources (Shigley's *Mechanical Engineering Design*, 9th ed., §6-7, eqs. 6-10 to 6-16, from
//! memory):
//! - the line through (10³, f·Sut) and (Ne = 10⁶, Se): a = (f·Sut)²/Se,
//!   b = −⅓·log10(f·Sut/Se); life N = (σar/a)^(1/b) for Se < σar < f·Sut;
//! - the fatigue strength fraction f, estimated: f = 0.9 when Sut < 490 MPa (70 kpsi), else
//!   f = (σ′F/Sut)·(2·10³)^b with σ′F = Sut + 345 MPa and b = −log10(σ′F/Se)/log10(2·Ne).
//!   The book writes the unmodified S′e in b; this takes the Se the line ends at, so the
//!   estimate and the line agree;
//! - a user's own Basquin curve through a reference point, N = Nref·(σar/Sref)^(−k), which is
//!   the same line with b = −1/k and a = Sref·Nref^(1/k), with an optional endurance limit.
//!
//! Cut-offs, stated with every life: at or below the endurance limit the life is infinite (no
//! damage); at or above the line's stress at 10³ cycles the point is in low-cycle fatigue,
//! where a stress-life line does not apply (common practice), and no life is given.

use core::fmt;

use crate::fmath;

/// Cycles at the line's upper end.
pub const LOW_CYCLE_END: f64 = 1e3;
/// Cycles at the endurance knee of the estimated line (Ne).
pub const KNEE_CYCLES: f64 = 1e6;

/// Why an S–N line was refused.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum SnError {
    /// A strength, cycle count or slope is not a positive finite number; names it.
    NotPositive(&'static str),
    /// The fraction f is outside (0, 1].
    FractionRange,
    /// f·Sut does not exceed Se: the line would not fall with life.
    FlatLine,
}

impl fmt::Display for SnError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            Self::NotPositive(n) => write!(f, "{n} must be a positive number"),
            Self::FractionRange => write!(f, "the fraction f must be above 0 and at most 1"),
            Self::FlatLine => write!(
                f,
                "f·Sut must be above the endurance limit Se for the line to fall with life"
            ),
        }
    }
}

fn positive(v: f64, what: &'static str) -> Result<f64, SnError> {
    if v.is_finite() && v > 0.0 {
        Ok(v)
    } else {
        Err(SnError::NotPositive(what))
    }
}

/// Shigley's estimate of the fatigue strength fraction f at 10³ cycles for a steel of
/// ultimate strength `sut_mpa` whose line ends at `se_mpa` (both MPa).
///
/// # Errors
/// [`SnError::NotPositive`] for a strength that is not positive.
pub fn estimated_fraction(sut_mpa: f64, se_mpa: f64) -> Result<f64, SnError> {
    let sut = positive(sut_mpa, "Sut")?;
    let se = positive(se_mpa, "Se")?;
    if sut < 490.0 {
        return Ok(0.9);
    }
    let sigma_f = sut + 345.0;
    let b = -fmath::log10(sigma_f / se) / fmath::log10(2.0 * KNEE_CYCLES);
    Ok(sigma_f / sut * fmath::powf(2.0 * LOW_CYCLE_END, b))
}

/// A Basquin line σar = a·N^b (b < 0) with its endurance limit, if any.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SnLine {
    /// Coefficient a (stress unit).
    pub a: f64,
    /// Exponent b (negative).
    pub b: f64,
    /// Amplitude at or below which the life is infinite; `None`: the line goes on.
    pub endurance: Option<f64>,
}

/// The life a line gives an amplitude.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Life {
    /// At or below the endurance limit: no damage.
    Infinite,
    /// Cycles to failure.
    Cycles(f64),
    /// At or above the line's stress at 10³ cycles: low-cycle fatigue, no life given.
    LowCycle,
}

impl SnLine {
    /// The line through (10³, f·Sut) and (10⁶, Se), ending at Se.
    ///
    /// # Errors
    /// [`SnError`] for a strength that is not positive, f outside (0, 1], or f·Sut ≤ Se.
    pub fn through_strengths(f: f64, sut: f64, se: f64) -> Result<Self, SnError> {
        let sut = positive(sut, "Sut")?;
        let se = positive(se, "Se")?;
        if !(f.is_finite() && f > 0.0 && f <= 1.0) {
            return Err(SnError::FractionRange);
        }
        let top = f * sut;
        if top <= se {
            return Err(SnError::FlatLine);
        }
        Ok(Self {
            a: top * top / se,
            b: -fmath::log10(top / se) / 3.0,
            endurance: Some(se),
        })
    }

    /// A user's curve N = Nref·(σar/Sref)^(−k), with an optional endurance limit.
    ///
    /// # Errors
    /// [`SnError::NotPositive`] for a reference, slope or limit that is not positive.
    pub fn basquin(
        n_ref: f64,
        s_ref: f64,
        k: f64,
        endurance: Option<f64>,
    ) -> Result<Self, SnError> {
        let n_ref = positive(n_ref, "the reference cycles")?;
        let s_ref = positive(s_ref, "the reference amplitude")?;
        let k = positive(k, "the slope k")?;
        let endurance = endurance
            .map(|e| positive(e, "the endurance limit"))
            .transpose()?;
        let a = s_ref * fmath::powf(n_ref, 1.0 / k);
        positive(a, "the line's coefficient")?;
        Ok(Self {
            a,
            b: -1.0 / k,
            endurance,
        })
    }

    /// The amplitude the line gives at `n` cycles.
    #[must_use]
    pub fn amplitude_at(&self, n: f64) -> f64 {
        self.a * fmath::powf(n, self.b)
    }

    /// The life of a fully reversed amplitude `sar` (≥ 0).
    #[must_use]
    pub fn life(&self, sar: f64) -> Life {
        if self.endurance.is_some_and(|e| sar <= e) || sar <= 0.0 {
            return Life::Infinite;
        }
        if sar >= self.amplitude_at(LOW_CYCLE_END) {
            return Life::LowCycle;
        }
        Life::Cycles(fmath::powf(sar / self.a, 1.0 / self.b))
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use proptest::prelude::*;

    fn close(a: f64, b: f64, tol: f64) -> bool {
        (a - b).abs() <= tol * b.abs()
    }

    #[test]
    fn estimated_fraction_follows_the_published_chart() {
        // Shigley 9th ed. fig. 6-18 (from memory): f ≈ 0.9 at 70 kpsi falling to ≈ 0.77 at
        // 200 kpsi with Se = 0.5·Sut.
        assert_eq!(estimated_fraction(400.0, 200.0), Ok(0.9));
        assert!(close(
            estimated_fraction(490.0, 245.0).unwrap(),
            0.896,
            0.002
        ));
        assert!(close(
            estimated_fraction(1400.0, 700.0).unwrap(),
            0.773,
            0.002
        ));
        assert_eq!(
            estimated_fraction(-1.0, 1.0),
            Err(SnError::NotPositive("Sut"))
        );
    }

    #[test]
    fn the_line_passes_through_its_two_points() {
        let l = SnLine::through_strengths(0.85, 700.0, 300.0).unwrap();
        assert!(close(l.amplitude_at(1e3), 0.85 * 700.0, 1e-12));
        assert!(close(l.amplitude_at(1e6), 300.0, 1e-12));
        assert_eq!(l.life(300.0), Life::Infinite);
        assert_eq!(l.life(0.85 * 700.0), Life::LowCycle);
        let Life::Cycles(n) = l.life(400.0) else {
            panic!()
        };
        assert!(close(l.amplitude_at(n), 400.0, 1e-12));
        assert_eq!(
            SnLine::through_strengths(0.4, 700.0, 300.0),
            Err(SnError::FlatLine)
        );
        assert_eq!(
            SnLine::through_strengths(1.2, 700.0, 300.0),
            Err(SnError::FractionRange)
        );
    }

    #[test]
    fn a_users_curve_meets_its_reference_point() {
        let l = SnLine::basquin(2e6, 80.0, 5.0, None).unwrap();
        let Life::Cycles(n) = l.life(80.0) else {
            panic!()
        };
        assert!(close(n, 2e6, 1e-12));
        let Life::Cycles(n) = l.life(160.0) else {
            panic!()
        };
        assert!(close(n, 2e6 / 32.0, 1e-12));
        let cut = SnLine::basquin(2e6, 80.0, 5.0, Some(50.0)).unwrap();
        assert_eq!(cut.life(50.0), Life::Infinite);
        assert!(SnLine::basquin(2e6, 80.0, 0.0, None).is_err());
    }

    proptest! {
        #[test]
        fn life_falls_as_the_amplitude_rises(f in 0.7f64..0.95, s1 in 0.0f64..1.0, s2 in 0.0f64..1.0) {
            let l = SnLine::through_strengths(f, 900.0, 350.0).unwrap();
            let (lo, hi) = (s1.min(s2), s1.max(s2));
            let at = |t: f64| 350.0 + t * (f * 900.0 - 350.0);
            if let (Life::Cycles(a), Life::Cycles(b)) = (l.life(at(lo)), l.life(at(hi))) {
                prop_assert!(a >= b);
                prop_assert!((1e3..=1e6).contains(&b));
            }
        }
    }
}
