//! Static failure criteria on the full 3D principal stresses, with the factor of safety by
//! proportional load scaling.
//!
//! Every criterion here is a failure function f(σ1, σ2, σ3) that is positively homogeneous of
//! degree one (f(kσ) = k·f(σ) for k > 0) and equals 1 on the envelope. Scaling every load — so
//! every stress — by n reaches the envelope when n·f(σ) = 1, so the factor of safety is
//! n = 1/f; an unloaded point (f ≤ 0) never reaches it along its load line.
//!
//! With σ1 ≥ σ2 ≥ σ3 and strengths as positive magnitudes (Shigley's *Mechanical Engineering
//! Design*, ch. 5, from memory):
//! - von Mises (distortion energy): f = σvm/Sy
//! - Tresca (maximum shear): f = (σ1 − σ3)/Sy
//! - maximum normal stress: f = max(σ1/Sut, −σ3/Suc)
//! - Coulomb–Mohr (brittle): f = max(σ1, 0)/Sut − min(σ3, 0)/Suc
//! - modified Mohr (brittle): f = σ1/Sut when σ3 ≥ 0, or σ1 > 0 > σ3 with −σ3 ≤ σ1;
//!   f = (Suc − Sut)·σ1/(Suc·Sut) − σ3/Suc when σ1 > 0 > σ3 with −σ3 > σ1; −σ3/Suc when σ1 ≤ 0
//!
//! The brittle criteria use Sut and Suc; where no Suc is given, Suc = Sut (printed beside the
//! figure: [`assumption`]).
//!
//! Which criteria apply: von Mises and Tresca to ductile materials, the three brittle criteria to
//! brittle ones ([`Criterion::applies_to`]; ductile means elongation ≥ 5 %, common practice).
//! A criterion that does not apply is not a verdict: [`verdicts`] marks it `judged = false`, and
//! its factor is a reference figure only.

use crate::fmath;
use crate::material::Strengths;
use crate::principal::principal_values;
use crate::tensor::StressTensor;
use alloc::vec::Vec;
use core::fmt;

/// A static failure criterion.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Criterion {
    /// Distortion energy.
    VonMises,
    /// Maximum shear stress.
    Tresca,
    /// Maximum normal stress.
    MaxNormal,
    /// Brittle Coulomb–Mohr.
    CoulombMohr,
    /// Modified Mohr.
    ModifiedMohr,
}

impl Criterion {
    /// All criteria in display order.
    pub const ALL: [Criterion; 5] = [
        Criterion::VonMises,
        Criterion::Tresca,
        Criterion::MaxNormal,
        Criterion::CoulombMohr,
        Criterion::ModifiedMohr,
    ];

    /// Its name.
    #[must_use]
    pub fn name(self) -> &'static str {
        match self {
            Self::VonMises => "von Mises (distortion energy)",
            Self::Tresca => "Tresca (maximum shear)",
            Self::MaxNormal => "maximum normal stress",
            Self::CoulombMohr => "Coulomb–Mohr (brittle)",
            Self::ModifiedMohr => "modified Mohr (brittle)",
        }
    }

    /// A stable short key.
    #[must_use]
    pub fn key(self) -> &'static str {
        match self {
            Self::VonMises => "vm",
            Self::Tresca => "tresca",
            Self::MaxNormal => "normal",
            Self::CoulombMohr => "cm",
            Self::ModifiedMohr => "mm",
        }
    }

    /// Whether the criterion applies to the material: von Mises and Tresca to ductile ones,
    /// maximum normal stress, Coulomb–Mohr and modified Mohr to brittle ones (Shigley ch. 5,
    /// from memory; ductility by elongation ≥ 5 %, common practice).
    #[must_use]
    pub fn applies_to(self, s: &Strengths) -> bool {
        match self {
            Self::VonMises | Self::Tresca => s.is_ductile(),
            Self::MaxNormal | Self::CoulombMohr | Self::ModifiedMohr => !s.is_ductile(),
        }
    }

    /// The criterion suggested for a material: von Mises when ductile (elongation ≥ 5 %, common
    /// practice), modified Mohr when brittle.
    #[must_use]
    pub fn suggested(s: &Strengths) -> Self {
        if s.is_ductile() {
            Self::VonMises
        } else {
            Self::ModifiedMohr
        }
    }
}

/// Why a criterion could not be applied.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum CriterionError {
    /// The criterion needs a yield strength the material lacks.
    NeedsYield,
}

impl fmt::Display for CriterionError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            Self::NeedsYield => {
                write!(f, "needs a yield strength, which this material has none of")
            }
        }
    }
}

/// The failure function f (dimensionless; 1 on the envelope) for sorted principal stresses.
///
/// # Errors
/// [`CriterionError::NeedsYield`] for von Mises or Tresca without Sy.
pub fn failure_index(c: Criterion, p: [f64; 3], s: &Strengths) -> Result<f64, CriterionError> {
    let [s1, s2, s3] = p;
    let sut = s.ultimate_tensile();
    let suc = s.ultimate_compressive().unwrap_or(sut);
    Ok(match c {
        Criterion::VonMises => {
            let sy = s.yield_strength().ok_or(CriterionError::NeedsYield)?;
            let vm = fmath::sqrt(
                0.5 * ((s1 - s2) * (s1 - s2) + (s2 - s3) * (s2 - s3) + (s3 - s1) * (s3 - s1)),
            );
            vm / sy
        }
        Criterion::Tresca => {
            let sy = s.yield_strength().ok_or(CriterionError::NeedsYield)?;
            (s1 - s3) / sy
        }
        Criterion::MaxNormal => fmath::max(fmath::max(s1 / sut, -s3 / suc), 0.0),
        Criterion::CoulombMohr => fmath::max(s1, 0.0) / sut - fmath::min(s3, 0.0) / suc,
        Criterion::ModifiedMohr => {
            if s3 >= 0.0 {
                s1 / sut
            } else if s1 <= 0.0 {
                -s3 / suc
            } else if -s3 <= s1 {
                s1 / sut
            } else {
                (suc - sut) * s1 / (suc * sut) - s3 / suc
            }
        }
    })
}

/// The assumption behind a criterion's figure for this material, to print beside it: the
/// brittle criteria without a compressive strength take Suc = Sut.
#[must_use]
pub fn assumption(c: Criterion, s: &Strengths) -> Option<&'static str> {
    let brittle_form = matches!(
        c,
        Criterion::MaxNormal | Criterion::CoulombMohr | Criterion::ModifiedMohr
    );
    (brittle_form && s.ultimate_compressive().is_none())
        .then_some("Suc = Sut assumed (no compressive strength given)")
}

/// The branch of the modified Mohr envelope that a state lies on (Shigley eq. 5-32, from memory).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum MohrBranch {
    /// σ1 governs: σ3 ≥ 0, or σ1 > 0 > σ3 with −σ3 ≤ σ1 (f = σ1/Sut).
    Tension,
    /// The sloped line of the fourth quadrant: σ1 > 0 > σ3 with −σ3 > σ1
    /// (f = (Suc − Sut)·σ1/(Suc·Sut) − σ3/Suc).
    Mixed,
    /// σ3 governs: σ1 ≤ 0 (f = −σ3/Suc).
    Compression,
}

impl MohrBranch {
    /// The branch of sorted principal stresses `p`.
    #[must_use]
    pub fn of(p: [f64; 3]) -> Self {
        let [s1, _, s3] = p;
        if s3 >= 0.0 || (s1 > 0.0 && -s3 <= s1) {
            Self::Tension
        } else if s1 <= 0.0 {
            Self::Compression
        } else {
            Self::Mixed
        }
    }

    /// The branch in words, with its equation.
    #[must_use]
    pub fn describe(self) -> &'static str {
        match self {
            Self::Tension => "tension branch: n = Sut/σ1",
            Self::Mixed => "mixed branch: 1/n = (Suc − Sut)·σ1/(Suc·Sut) − σ3/Suc",
            Self::Compression => "compression branch: n = Suc/(−σ3)",
        }
    }
}

/// One criterion's verdict.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Verdict {
    /// The criterion.
    pub criterion: Criterion,
    /// Whether it applies to the material ([`Criterion::applies_to`]). When false, `factor` is a
    /// reference figure and `passes`/`margin` must not be shown as a judgement.
    pub judged: bool,
    /// Factor of safety n = 1/f; `None` when the point is unloaded for this criterion.
    pub factor: Option<f64>,
    /// n ≥ the required factor.
    pub passes: bool,
    /// n/n_required − 1 (positive: spare margin); `None` when unloaded.
    pub margin: Option<f64>,
}

/// Every criterion that can be computed for the material, with pass/fail against `required`
/// (≥ 1); `judged` says whether it applies ([`Criterion::applies_to`]). Criteria that need a
/// yield strength the material lacks are left out.
#[must_use]
pub fn verdicts(t: &StressTensor, s: &Strengths, required: f64) -> Vec<Verdict> {
    let p = principal_values(t);
    Criterion::ALL
        .iter()
        .filter_map(|&c| {
            let f = failure_index(c, p, s).ok()?;
            let factor = (f > 0.0).then(|| 1.0 / f).filter(|n| n.is_finite());
            Some(Verdict {
                criterion: c,
                judged: c.applies_to(s),
                factor,
                passes: factor.is_none_or(|n| n >= required),
                margin: factor.map(|n| n / required - 1.0),
            })
        })
        .collect()
}

/// The envelope of a criterion in the plane of two principal stresses (σA, σB) with the third
/// zero — the plane-stress failure locus — as `points` points around the origin, each at the
/// radius 1/f of its direction.
///
/// # Errors
/// As [`failure_index`].
pub fn envelope(
    c: Criterion,
    s: &Strengths,
    points: usize,
) -> Result<Vec<(f64, f64)>, CriterionError> {
    let n = points.max(8);
    let mut out = Vec::with_capacity(n + 1);
    for i in 0..=n {
        let psi = 2.0 * core::f64::consts::PI * i as f64 / n as f64;
        let (a, b) = (fmath::cos(psi), fmath::sin(psi));
        let mut p = [a, b, 0.0];
        p.sort_by(|x, y| y.total_cmp(x));
        let f = failure_index(c, p, s)?;
        if f > 0.0 {
            out.push((a / f, b / f));
        }
    }
    Ok(out)
}

#[cfg(test)]
mod tests {
    use super::*;
    use proptest::prelude::*;

    fn ductile() -> Strengths {
        Strengths::try_new(Some(350.0), 500.0, None, 20.0, None).unwrap()
    }
    fn brittle() -> Strengths {
        Strengths::try_new(None, 200.0, Some(700.0), 0.5, None).unwrap()
    }

    #[test]
    fn envelopes_pass_through_the_uniaxial_strengths() {
        for c in [Criterion::VonMises, Criterion::Tresca] {
            assert!((failure_index(c, [350.0, 0.0, 0.0], &ductile()).unwrap() - 1.0).abs() < 1e-15);
            assert!(
                (failure_index(c, [0.0, 0.0, -350.0], &ductile()).unwrap() - 1.0).abs() < 1e-15
            );
        }
        for c in [
            Criterion::MaxNormal,
            Criterion::CoulombMohr,
            Criterion::ModifiedMohr,
        ] {
            assert!((failure_index(c, [200.0, 0.0, 0.0], &brittle()).unwrap() - 1.0).abs() < 1e-15);
            assert!(
                (failure_index(c, [0.0, 0.0, -700.0], &brittle()).unwrap() - 1.0).abs() < 1e-15
            );
        }
    }

    #[test]
    fn pure_shear_yields_at_the_published_fractions() {
        // Pure shear τ: von Mises yields at τ = Sy/√3 = 0.577 Sy, Tresca at 0.5 Sy (Shigley §5-4,
        // §5-5, from memory).
        let s = ductile();
        let tau = 100.0;
        let p = [tau, 0.0, -tau];
        let n_vm = 1.0 / failure_index(Criterion::VonMises, p, &s).unwrap();
        let n_tr = 1.0 / failure_index(Criterion::Tresca, p, &s).unwrap();
        assert!((n_vm * tau - 350.0 / 3f64.sqrt()).abs() < 1e-9);
        assert!((n_tr * tau - 175.0).abs() < 1e-9);
    }

    #[test]
    fn modified_mohr_in_the_fourth_quadrant() {
        // Shigley eq. 5-32b (from memory): for σA ≥ 0 ≥ σB and |σB/σA| > 1,
        // (Suc − Sut)σA/(Suc·Sut) − σB/Suc = 1/n.
        let s = brittle();
        let (a, b) = (50.0, -300.0);
        let want = 1.0 / ((700.0 - 200.0) * a / (700.0 * 200.0) - b / 700.0);
        let got = 1.0 / failure_index(Criterion::ModifiedMohr, [a, 0.0, b], &s).unwrap();
        assert!((got - want).abs() < 1e-12 * want);
        // Below the diagonal it is the maximum normal stress.
        let got = 1.0 / failure_index(Criterion::ModifiedMohr, [150.0, 0.0, -100.0], &s).unwrap();
        assert!((got - 200.0 / 150.0).abs() < 1e-12);
    }

    #[test]
    fn verdicts_skip_yield_criteria_for_cast_iron_and_judge_the_rest() {
        let t = StressTensor::plane(80.0, -120.0, 30.0).unwrap();
        let v = verdicts(&t, &brittle(), 2.0);
        assert!(v
            .iter()
            .all(|v| !matches!(v.criterion, Criterion::VonMises | Criterion::Tresca)));
        assert_eq!(v.len(), 3);
        let unloaded = verdicts(&StressTensor::ZERO, &ductile(), 2.0);
        assert!(unloaded.iter().all(|v| v.factor.is_none() && v.passes));
        assert_eq!(Criterion::suggested(&brittle()), Criterion::ModifiedMohr);
    }

    #[test]
    fn only_the_criteria_of_the_materials_kind_are_judged() {
        let t = StressTensor::plane(80.0, -120.0, 30.0).unwrap();
        let judged = |s: &Strengths| -> Vec<Criterion> {
            verdicts(&t, s, 2.0)
                .into_iter()
                .filter(|v| v.judged)
                .map(|v| v.criterion)
                .collect()
        };
        assert_eq!(judged(&ductile()), [Criterion::VonMises, Criterion::Tresca]);
        assert_eq!(
            judged(&brittle()),
            [
                Criterion::MaxNormal,
                Criterion::CoulombMohr,
                Criterion::ModifiedMohr
            ]
        );
        // A ductile material has no Suc: its brittle reference figures say what they assume.
        assert!(assumption(Criterion::CoulombMohr, &ductile())
            .unwrap()
            .contains("Suc = Sut"));
        assert!(assumption(Criterion::VonMises, &ductile()).is_none());
        assert!(assumption(Criterion::ModifiedMohr, &brittle()).is_none());
    }

    #[test]
    fn the_modified_mohr_branch_is_reported() {
        // Shigley eq. 5-32 (from memory): the three pieces of the envelope.
        assert_eq!(MohrBranch::of([150.0, 0.0, -100.0]), MohrBranch::Tension);
        assert_eq!(MohrBranch::of([150.0, 50.0, 0.0]), MohrBranch::Tension);
        assert_eq!(MohrBranch::of([50.0, 0.0, -300.0]), MohrBranch::Mixed);
        assert_eq!(
            MohrBranch::of([0.0, -10.0, -300.0]),
            MohrBranch::Compression
        );
        // Each branch's equation is the one failure_index uses there.
        let s = brittle();
        for p in [
            [150.0, 0.0, -100.0],
            [50.0, 0.0, -300.0],
            [-5.0, -10.0, -300.0],
        ] {
            let f = failure_index(Criterion::ModifiedMohr, p, &s).unwrap();
            let want = match MohrBranch::of(p) {
                MohrBranch::Tension => p[0] / 200.0,
                MohrBranch::Mixed => (700.0 - 200.0) * p[0] / (700.0 * 200.0) - p[2] / 700.0,
                MohrBranch::Compression => -p[2] / 700.0,
            };
            assert!((f - want).abs() < 1e-15, "{p:?}");
        }
    }

    #[test]
    fn envelope_points_lie_on_the_envelope() {
        for c in Criterion::ALL {
            let s = if matches!(c, Criterion::VonMises | Criterion::Tresca) {
                ductile()
            } else {
                brittle()
            };
            for (a, b) in envelope(c, &s, 72).unwrap() {
                let mut p = [a, b, 0.0];
                p.sort_by(|x, y| y.total_cmp(x));
                assert!(
                    (failure_index(c, p, &s).unwrap() - 1.0).abs() < 1e-12,
                    "{c:?}"
                );
            }
        }
    }

    proptest! {
        #[test]
        fn the_factor_scales_as_one_over_k(c in prop::array::uniform6(-400.0..400.0f64), k in 0.01..100.0f64) {
            let t = StressTensor::new(c[0], c[1], c[2], c[3], c[4], c[5]).unwrap();
            for s in [ductile(), brittle()] {
                let a = verdicts(&t, &s, 1.0);
                let b = verdicts(&t.scaled(k).unwrap(), &s, 1.0);
                for (x, y) in a.iter().zip(&b) {
                    if let (Some(nx), Some(ny)) = (x.factor, y.factor) {
                        prop_assert!((ny - nx / k).abs() <= 1e-9 * nx / k, "{:?}: {nx} {ny}", x.criterion);
                    }
                }
            }
        }

        #[test]
        fn tresca_is_never_less_conservative_than_von_mises(c in prop::array::uniform6(-400.0..400.0f64)) {
            let t = StressTensor::new(c[0], c[1], c[2], c[3], c[4], c[5]).unwrap();
            let v = verdicts(&t, &ductile(), 1.0);
            let n = |k: Criterion| v.iter().find(|v| v.criterion == k).and_then(|v| v.factor);
            if let (Some(vm), Some(tr)) = (n(Criterion::VonMises), n(Criterion::Tresca)) {
                prop_assert!(tr <= vm * (1.0 + 1e-12), "{tr} > {vm}");
            }
        }
    }
}
