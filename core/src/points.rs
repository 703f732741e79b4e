//! Measures of many points at once, for tables of stress states (finite-element exports, gauge
//! loggers): per point σ1 ≥ σ2 ≥ σ3, the absolute maximum shear τmax = (σ1 − σ3)/2, von Mises
//! σvm = √(3·J2), the Tresca intensity σ1 − σ3, the triaxiality σm/σvm (NaN for a hydrostatic
//! state, as in [`crate::equivalent`]) and the static factor of safety n = 1/f of a criterion
//! ([`crate::criteria::failure_index`]; infinite when unloaded, NaN where the criterion does not
//! apply). The ranking orders points worst first.
//!
//! The principal values come from the batch entry point [`crate::principal_values_into`]; every
//! other measure is the same formula as for one point, so a row of a table and the same state
//! typed in agree to the last bit (tested).

use crate::criteria::{failure_index, Criterion};
use crate::equivalent::{von_mises, DEVIATOR_FLOOR};
use crate::error::StressError;
use crate::fmath;
use crate::invariants::mean_stress;
use crate::material::Strengths;
use crate::principal::principal_values_into;
use crate::tensor::StressTensor;
use alloc::vec;
use alloc::vec::Vec;

/// The measures of one point, in the tensors' unit.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PointMeasures {
    /// Principal stresses σ1 ≥ σ2 ≥ σ3.
    pub principal: [f64; 3],
    /// Absolute maximum shear (σ1 − σ3)/2 ≥ 0.
    pub tau_max: f64,
    /// von Mises equivalent √(3·J2) ≥ 0.
    pub von_mises: f64,
    /// Tresca intensity σ1 − σ3 ≥ 0.
    pub tresca: f64,
    /// Triaxiality σm/σvm; NaN for a hydrostatic state.
    pub triaxiality: f64,
    /// Static factor of safety 1/f; +∞ when unloaded, NaN when the criterion does not apply.
    pub factor: f64,
}

impl PointMeasures {
    /// The measures in stress units, in table order: σ1, σ2, σ3, τmax, von Mises, Tresca.
    #[must_use]
    pub fn stresses(&self) -> [f64; 6] {
        let [s1, s2, s3] = self.principal;
        [s1, s2, s3, self.tau_max, self.von_mises, self.tresca]
    }
}

/// Which measure ranks the points.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Measure {
    /// σ1 (highest first).
    Sigma1,
    /// σ2 (highest first).
    Sigma2,
    /// σ3 (lowest first: the most compressive).
    Sigma3,
    /// τmax (highest first).
    TauMax,
    /// von Mises (highest first).
    VonMises,
    /// Tresca intensity (highest first).
    Tresca,
    /// Triaxiality (highest first: the most tensile hydrostatic part).
    Triaxiality,
    /// Factor of safety (lowest first).
    Factor,
}

impl Measure {
    /// Every measure, in the order a table shows them.
    pub const ALL: [Measure; 8] = [
        Measure::Sigma1,
        Measure::Sigma2,
        Measure::Sigma3,
        Measure::TauMax,
        Measure::VonMises,
        Measure::Tresca,
        Measure::Triaxiality,
        Measure::Factor,
    ];

    /// Its value for a point.
    #[must_use]
    pub fn of(self, m: &PointMeasures) -> f64 {
        match self {
            Measure::Sigma1 => m.principal[0],
            Measure::Sigma2 => m.principal[1],
            Measure::Sigma3 => m.principal[2],
            Measure::TauMax => m.tau_max,
            Measure::VonMises => m.von_mises,
            Measure::Tresca => m.tresca,
            Measure::Triaxiality => m.triaxiality,
            Measure::Factor => m.factor,
        }
    }

    /// Whether a lower value is worse (factor of safety, σ3).
    #[must_use]
    pub fn lower_is_worse(self) -> bool {
        matches!(self, Measure::Factor | Measure::Sigma3)
    }
}

/// The value of measure `by` for every point, in order (what a table's pictures draw).
#[must_use]
// Never inlined, to keep core's speed settings (see `principal_values_into`).
#[inline(never)]
pub fn values_of(measures: &[PointMeasures], by: Measure) -> Vec<f64> {
    measures.iter().map(|m| by.of(m)).collect()
}

/// The allowable value of a measure: where the criterion in use reaches the required factor of
/// safety `required`, when that criterion limits this measure on its own (a line a plot of the
/// measure can draw). Same unit as `strengths`. From the criteria's failure functions
/// ([`crate::criteria::failure_index`]; the limits are as in Shigley ch. 5, from memory):
/// - factor of safety: `required`;
/// - von Mises under von Mises: Sy/n; Tresca intensity under Tresca: Sy/n, and τmax under
///   Tresca: Sy/(2n);
/// - σ1 under maximum normal stress: Sut/n; σ3: −Suc/n (Suc = Sut when none is given).
///
/// `None` where the criterion does not limit the measure alone (σ1 under Coulomb–Mohr depends
/// on σ3 too, say), or it needs a yield strength the material lacks.
#[must_use]
pub fn allowable(
    measure: Measure,
    criterion: Criterion,
    strengths: &Strengths,
    required: f64,
) -> Option<f64> {
    if !(required.is_finite() && required > 0.0) {
        return None;
    }
    let sy = strengths.yield_strength();
    let sut = strengths.ultimate_tensile();
    let suc = strengths.ultimate_compressive().unwrap_or(sut);
    match (measure, criterion) {
        (Measure::Factor, _) => Some(required),
        (Measure::VonMises, Criterion::VonMises) | (Measure::Tresca, Criterion::Tresca) => {
            sy.map(|sy| sy / required)
        }
        (Measure::TauMax, Criterion::Tresca) => sy.map(|sy| 0.5 * sy / required),
        (Measure::Sigma1, Criterion::MaxNormal) => Some(sut / required),
        (Measure::Sigma3, Criterion::MaxNormal) => Some(-suc / required),
        _ => None,
    }
}

/// Indices of the `k` worst of `measures` by `by`, worst first: the first `k` of
/// [`worst_first`], found without sorting every point. A few (up to [`SCAN_AT_MOST`]) are kept
/// in order in one pass, with no copy of the measures; more come from a selection, then a sort
/// of `k`.
#[must_use]
// Never inlined, to keep core's speed settings (see `principal_values_into`).
#[inline(never)]
pub fn worst_few(measures: &[PointMeasures], by: Measure, k: usize) -> Vec<usize> {
    if k <= SCAN_AT_MOST {
        worst_few_by_scan(measures, by, k)
    } else {
        worst_few_by_selection(measures, by, k)
    }
}

/// The most [`worst_few`] finds in one pass; a page's list of worst rows is shorter.
pub const SCAN_AT_MOST: usize = 64;

fn worst_few_by_scan(measures: &[PointMeasures], by: Measure, k: usize) -> Vec<usize> {
    if k == 0 {
        return Vec::new();
    }
    let sign = sign_of(by);
    // The worst so far, in ranking order; a point joins only when it ranks before the last.
    let mut kept: Vec<(bool, f64, usize)> = Vec::with_capacity(k + 1);
    for (i, m) in measures.iter().enumerate() {
        let key = key_of(by.of(m), sign, i);
        if kept.len() == k {
            if compare_keyed(&key, &kept[k - 1]).is_ge() {
                continue;
            }
            kept.pop();
        }
        let at = kept.partition_point(|x| compare_keyed(x, &key).is_lt());
        kept.insert(at, key);
    }
    kept.into_iter().map(|(_, _, i)| i).collect()
}

fn worst_few_by_selection(measures: &[PointMeasures], by: Measure, k: usize) -> Vec<usize> {
    let mut keyed = keyed(measures, by);
    let k = k.min(keyed.len());
    if k == 0 {
        return Vec::new();
    }
    if k < keyed.len() {
        keyed.select_nth_unstable_by(k - 1, compare_keyed);
        keyed.truncate(k);
    }
    keyed.sort_unstable_by(compare_keyed);
    keyed.into_iter().map(|(_, _, i)| i).collect()
}

/// (NaN?, key growing with badness reversed, index): the ranking order of [`worst_first`].
fn keyed(measures: &[PointMeasures], by: Measure) -> Vec<(bool, f64, usize)> {
    let sign = sign_of(by);
    measures
        .iter()
        .enumerate()
        .map(|(i, m)| key_of(by.of(m), sign, i))
        .collect()
}

/// 1 where a lower value is worse, else −1: the key grows as the point gets better.
fn sign_of(by: Measure) -> f64 {
    if by.lower_is_worse() {
        1.0
    } else {
        -1.0
    }
}

/// A point's place in the ranking: NaN last, then by signed value (−0 made +0), then by index.
fn key_of(v: f64, sign: f64, i: usize) -> (bool, f64, usize) {
    (v.is_nan(), if v.is_nan() { 0.0 } else { sign * v + 0.0 }, i)
}

fn compare_keyed(a: &(bool, f64, usize), b: &(bool, f64, usize)) -> core::cmp::Ordering {
    a.0.cmp(&b.0)
        .then_with(|| a.1.total_cmp(&b.1))
        .then_with(|| a.2.cmp(&b.2))
}

/// The measures of every tensor (same unit as `strengths`), judged with `criterion`.
///
/// # Errors
/// Never for well-formed input; the batch principal solver's length check is passed on.
pub fn measure_all(
    tensors: &[StressTensor],
    criterion: Criterion,
    strengths: &Strengths,
) -> Result<Vec<PointMeasures>, StressError> {
    let mut out = Vec::new();
    measure_all_into(tensors, criterion, strengths, &mut out)?;
    Ok(out)
}

/// [`measure_all`], the measures appended to `out` (a table computed a chunk at a time
/// keeps one list and never copies it).
///
/// # Errors
/// As [`measure_all`]; `out` is then left as it was.
// Never inlined, to keep core's speed settings (see `principal_values_into`).
#[inline(never)]
pub fn measure_all_into(
    tensors: &[StressTensor],
    criterion: Criterion,
    strengths: &Strengths,
    out: &mut Vec<PointMeasures>,
) -> Result<(), StressError> {
    let mut principal = vec![[0.0; 3]; tensors.len()];
    principal_values_into(tensors, &mut principal)?;
    out.extend(
        tensors
            .iter()
            .zip(principal)
            .map(|(t, p)| measure_one(t, p, criterion, strengths)),
    );
    Ok(())
}

fn measure_one(
    t: &StressTensor,
    p: [f64; 3],
    criterion: Criterion,
    strengths: &Strengths,
) -> PointMeasures {
    let von_mises = von_mises(t);
    let tresca = fmath::max(p[0] - p[2], 0.0);
    let defined = von_mises > DEVIATOR_FLOOR * t.frobenius_norm();
    let factor = match failure_index(criterion, p, strengths) {
        Ok(f) if f > 0.0 => 1.0 / f,
        Ok(_) => f64::INFINITY,
        Err(_) => f64::NAN,
    };
    PointMeasures {
        principal: p,
        tau_max: 0.5 * tresca,
        von_mises,
        tresca,
        triaxiality: if defined {
            mean_stress(t) / von_mises
        } else {
            f64::NAN
        },
        factor,
    }
}

/// Indices of `measures`, worst first by `by`: NaN values last, ties kept in input order (so the
/// earlier row comes first).
#[must_use]
// Never inlined, to keep core's speed settings (see `principal_values_into`).
#[inline(never)]
pub fn worst_first(measures: &[PointMeasures], by: Measure) -> Vec<usize> {
    // Sort (NaN?, key, index) triples held together: a cheap comparison on contiguous data,
    // and the index makes the unstable sort give the stable order.
    let mut keyed = keyed(measures, by);
    keyed.sort_unstable_by(compare_keyed);
    keyed.into_iter().map(|(_, _, i)| i).collect()
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::equivalent::Equivalent;
    use crate::principal::principal_values;
    use proptest::prelude::*;

    fn steel() -> Strengths {
        Strengths::try_new(Some(250.0), 420.0, None, 22.0, None).unwrap()
    }

    proptest! {
        #[test]
        fn measuring_a_chunk_at_a_time_appends_what_measuring_whole_gives(
            cs in proptest::collection::vec(proptest::array::uniform6(-500.0f64..500.0), 0..40),
            cut in 0usize..40,
        ) {
            let ts: Vec<StressTensor> = cs
                .iter()
                .map(|c| StressTensor::new(c[0], c[1], c[2], c[3], c[4], c[5]).unwrap())
                .collect();
            let whole = measure_all(&ts, Criterion::Tresca, &steel()).unwrap();
            let (a, b) = ts.split_at(cut.min(ts.len()));
            let mut parts = Vec::new();
            measure_all_into(a, Criterion::Tresca, &steel(), &mut parts).unwrap();
            prop_assert_eq!(parts.len(), a.len());
            measure_all_into(b, Criterion::Tresca, &steel(), &mut parts).unwrap();
            // Bit for bit (NaN-free here: no hydrostatic states at these odds).
            prop_assert_eq!(parts, whole);
        }

        #[test]
        fn a_row_agrees_with_the_same_state_typed_in(c in proptest::array::uniform6(-500.0f64..500.0)) {
            let t = StressTensor::new(c[0], c[1], c[2], c[3], c[4], c[5]).unwrap();
            let m = measure_all(&[t; 9], Criterion::VonMises, &steel()).unwrap();
            let e = Equivalent::of(&t);
            for r in &m {
                // The batch path may differ from the one-point solver in the last bits only.
                let p = principal_values(&t);
                for (got, want) in r.principal.iter().zip(p) {
                    prop_assert!((got - want).abs() <= 1e-12 * (1.0 + t.max_abs()));
                }
                prop_assert_eq!(r.von_mises, e.von_mises);
                prop_assert!((r.tresca - e.tresca).abs() <= 1e-12 * (1.0 + t.max_abs()));
                prop_assert_eq!(r.triaxiality.is_nan(), e.triaxiality.is_none());
                if let Some(x) = e.triaxiality {
                    prop_assert_eq!(r.triaxiality, x);
                }
                prop_assert!((r.factor * r.von_mises - 250.0).abs() <= 1e-9 * 250.0);
            }
        }
    }

    proptest! {
        #[test]
        fn the_few_worst_are_the_first_of_the_ranking(
            sx in proptest::collection::vec(prop_oneof![-3i32..3, Just(0)], 0..40),
            k in 0usize..45,
        ) {
            // Small integers: many ties, which must keep file order in both.
            let rows: Vec<StressTensor> = sx
                .iter()
                .map(|&v| StressTensor::plane(f64::from(v) * 50.0, 0.0, 0.0).unwrap())
                .collect();
            let iron = Strengths::try_new(None, 200.0, None, 0.5, None).unwrap();
            for s in [steel(), iron] {
                let m = measure_all(&rows, Criterion::VonMises, &s).unwrap();
                for by in Measure::ALL {
                    let all = worst_first(&m, by);
                    let want = all[..k.min(all.len())].to_vec();
                    prop_assert_eq!(&worst_few(&m, by, k), &want);
                    // Both ways of finding them, whatever `k`.
                    prop_assert_eq!(&worst_few_by_scan(&m, by, k), &want);
                    prop_assert_eq!(&worst_few_by_selection(&m, by, k), &want);
                }
            }
        }

        #[test]
        fn a_state_at_the_allowable_has_the_required_factor(
            c in proptest::array::uniform6(-500.0f64..500.0),
            required in 1.0f64..4.0,
        ) {
            // Scale the state so its measure sits on the allowable: n must then be `required`.
            let t = StressTensor::new(c[0], c[1], c[2], c[3], c[4], c[5]).unwrap();
            let iron = Strengths::try_new(None, 200.0, Some(700.0), 0.5, None).unwrap();
            for (s, criteria) in [
                (steel(), &[Criterion::VonMises, Criterion::Tresca][..]),
                (iron, &[Criterion::MaxNormal][..]),
            ] {
                for &criterion in criteria {
                    for by in Measure::ALL {
                        let Some(a) = allowable(by, criterion, &s, required) else { continue };
                        let m = measure_all(&[t], criterion, &s).unwrap()[0];
                        if by == Measure::Factor {
                            prop_assert_eq!(a, required);
                            continue;
                        }
                        let v = by.of(&m);
                        // Only where this measure is the one that governs the criterion.
                        let k = a / v;
                        if !(k.is_finite() && k > 0.0) { continue; }
                        let Ok(ts) = t.scaled(k) else { continue };
                        let scaled = measure_all(&[ts], criterion, &s).unwrap()[0];
                        if criterion == Criterion::MaxNormal {
                            let other = if by == Measure::Sigma1 { Measure::Sigma3 } else { Measure::Sigma1 };
                            let o = other.of(&scaled);
                            let oa = allowable(other, criterion, &s, required).unwrap();
                            if (other == Measure::Sigma1 && o > oa) || (other == Measure::Sigma3 && o < oa) { continue; }
                        }
                        prop_assert!((scaled.factor - required).abs() <= 1e-9 * required,
                            "{by:?} {criterion:?}: n = {}", scaled.factor);
                    }
                }
            }
        }
    }

    #[test]
    fn measures_without_a_limit_of_their_own_have_no_allowable() {
        let s = steel();
        assert_eq!(
            allowable(Measure::VonMises, Criterion::VonMises, &s, 2.0),
            Some(125.0)
        );
        assert_eq!(
            allowable(Measure::TauMax, Criterion::Tresca, &s, 2.0),
            Some(62.5)
        );
        assert_eq!(
            allowable(Measure::Triaxiality, Criterion::VonMises, &s, 2.0),
            None
        );
        assert_eq!(
            allowable(Measure::Tresca, Criterion::VonMises, &s, 2.0),
            None
        );
        assert_eq!(
            allowable(Measure::Sigma1, Criterion::CoulombMohr, &s, 2.0),
            None
        );
        assert_eq!(
            allowable(Measure::Factor, Criterion::CoulombMohr, &s, 0.0),
            None
        );
        let iron = Strengths::try_new(None, 200.0, None, 0.5, None).unwrap();
        assert_eq!(
            allowable(Measure::VonMises, Criterion::VonMises, &iron, 2.0),
            None
        );
        assert_eq!(
            allowable(Measure::Sigma3, Criterion::MaxNormal, &iron, 2.0),
            Some(-100.0)
        );
    }

    #[test]
    fn unloaded_and_inapplicable_factors_are_marked() {
        let zero = StressTensor::new(0.0, 0.0, 0.0, 0.0, 0.0, 0.0).unwrap();
        let m = measure_all(&[zero], Criterion::VonMises, &steel()).unwrap();
        assert_eq!(m[0].factor, f64::INFINITY);
        assert!(m[0].triaxiality.is_nan());
        // Grey iron has no yield strength: von Mises does not apply.
        let iron = Strengths::try_new(None, 200.0, Some(700.0), 0.5, None).unwrap();
        let t = StressTensor::plane(50.0, 0.0, 0.0).unwrap();
        let m = measure_all(&[t], Criterion::VonMises, &iron).unwrap();
        assert!(m[0].factor.is_nan());
        let m = measure_all(&[t], Criterion::ModifiedMohr, &iron).unwrap();
        assert!((m[0].factor - 4.0).abs() < 1e-12); // Sut/σ1 = 200/50
    }

    #[test]
    fn values_of_a_measure_are_each_points_own() {
        let ts = [
            StressTensor::new(100.0, -20.0, 5.0, 30.0, 0.0, -8.0).unwrap(),
            StressTensor::new(-60.0, 0.0, 0.0, 0.0, 12.0, 0.0).unwrap(),
        ];
        let m = measure_all(&ts, Criterion::VonMises, &steel()).unwrap();
        let field = |by: Measure| -> Vec<f64> {
            m.iter()
                .map(|p| match by {
                    Measure::Sigma1 => p.principal[0],
                    Measure::Sigma2 => p.principal[1],
                    Measure::Sigma3 => p.principal[2],
                    Measure::TauMax => p.tau_max,
                    Measure::VonMises => p.von_mises,
                    Measure::Tresca => p.tresca,
                    Measure::Triaxiality => p.triaxiality,
                    Measure::Factor => p.factor,
                })
                .collect()
        };
        for by in Measure::ALL {
            assert_eq!(values_of(&m, by), field(by), "{by:?}");
        }
    }

    #[test]
    fn the_worst_rows_come_first() {
        let t = |sx: f64| StressTensor::plane(sx, 0.0, 0.0).unwrap();
        let rows = [t(100.0), t(200.0), t(0.0), t(200.0), t(-300.0)];
        let m = measure_all(&rows, Criterion::VonMises, &steel()).unwrap();
        // Lowest factor first; ties keep file order; the unloaded row (n = ∞) last.
        assert_eq!(worst_first(&m, Measure::Factor), vec![4, 1, 3, 0, 2]);
        assert_eq!(worst_first(&m, Measure::VonMises), vec![4, 1, 3, 0, 2]);
        assert_eq!(worst_first(&m, Measure::Sigma1), vec![1, 3, 0, 2, 4]);
        assert_eq!(worst_first(&m, Measure::Sigma3)[0], 4);
        // NaN sorts last whatever the direction.
        let iron = Strengths::try_new(None, 200.0, None, 0.5, None).unwrap();
        let m = measure_all(&rows, Criterion::VonMises, &iron).unwrap();
        assert_eq!(worst_first(&m, Measure::Factor), vec![0, 1, 2, 3, 4]);
    }
}
