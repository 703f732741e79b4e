//! The scan of a section for its critical points: samples around the perimeter (and through the
//! wall of a tube), the highest von Mises and σ1 refined by golden-section search, and the same
//! search for any ranking a caller passes ([`Rank`]: a severity and a tie-breaker), which is how
//! the page finds where its decision is hardest.

use super::{Concentration, Loads, Location, Pressure, Rectangle, Round, Section, SectionError};
use crate::equivalent::von_mises;
use crate::fmath;
use crate::principal::principal_values;
use crate::tensor::StressTensor;
use alloc::vec::Vec;
use core::f64::consts::PI;

/// One point of a scan curve.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Sample {
    /// Position along the curve: φ in radians (round) or the perimeter length s (rectangle).
    pub position: f64,
    /// von Mises stress there.
    pub von_mises: f64,
    /// Largest principal stress σ1 there.
    pub sigma1: f64,
}

/// Which line of points a scan curve follows.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Path {
    /// The outer surface of a round section, against φ.
    Outer,
    /// The bore of a tube, against φ.
    Bore,
    /// The perimeter of a rectangle, against s measured from the corner (y, z) = (h/2, −b/2)
    /// in the sense of increasing φ.
    Perimeter,
}

/// Samples along one path.
#[derive(Debug, Clone, PartialEq)]
pub struct Curve {
    /// The path.
    pub path: Path,
    /// Samples in order of position.
    pub samples: Vec<Sample>,
}

/// A critical point found by a scan.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Critical {
    /// Where it is.
    pub at: Location,
    /// Its position on the scan's plot axis (φ in radians, or s).
    pub position: f64,
    /// The value there.
    pub value: f64,
}

/// Golden-section steps: 0.618^43 < 1e-9.
const GOLDEN_STEPS: usize = 43;

/// What [`Section::scan`] finds.
#[derive(Debug, Clone, PartialEq)]
pub struct Scan {
    /// The sampled curves (outer surface and bore, or the perimeter).
    pub curves: Vec<Curve>,
    /// The point of highest von Mises stress, refined between samples (and through the wall of a
    /// tube).
    pub max_von_mises: Critical,
    /// The point of highest principal stress σ1, refined likewise.
    pub max_principal: Critical,
}

/// Golden-section search for the maximum of `f` on [lo, hi]; returns (x, f(x)).
///
/// Stops once the bracket is 1e-9 of its first width (43 steps of 0.618): near a smooth
/// maximum f is flat to second order, so f in double precision cannot place x closer than about
/// √ε ≈ 1e-8 of the scale anyway, and further steps would only chase rounding.
fn golden_max<F>(mut lo: f64, mut hi: f64, f: F) -> Result<(f64, f64), SectionError>
where
    F: Fn(f64) -> Result<f64, SectionError>,
{
    let g = 0.5 * (fmath::sqrt(5.0) - 1.0);
    let (mut c, mut d) = (hi - g * (hi - lo), lo + g * (hi - lo));
    let (mut fc, mut fd) = (f(c)?, f(d)?);
    for _ in 0..GOLDEN_STEPS {
        if fc > fd {
            hi = d;
            d = c;
            fd = fc;
            c = hi - g * (hi - lo);
            fc = f(c)?;
        } else {
            lo = c;
            c = d;
            fc = fd;
            d = lo + g * (hi - lo);
            fd = f(d)?;
        }
    }
    let x = 0.5 * (lo + hi);
    Ok((x, f(x)?))
}

/// von Mises and σ1 of a tensor (σvm from J2 alone, one eigenvalue solve for σ1).
fn measures(s: &StressTensor) -> (f64, f64) {
    (von_mises(s), principal_values(s)[0])
}

/// The ranks of a scan's two maxima: highest von Mises, highest σ1 (no tie-breaker: the first
/// sample in scan order wins a tie).
fn by_von_mises(t: &StressTensor) -> Rank {
    Rank {
        severity: von_mises(t),
        tie: 0.0,
    }
}

fn by_sigma1(t: &StressTensor) -> Rank {
    Rank {
        severity: principal_values(t)[0],
        tie: 0.0,
    }
}

/// The most severe of a scan's coarse samples so far: its rank and where it is.
struct Best<P>(Option<(Rank, P)>);

impl<P: Copy> Best<P> {
    const fn new() -> Self {
        Self(None)
    }

    /// Keeps `here` when it beats the best so far (so of equals the first one stays).
    fn offer(&mut self, here: Rank, at: P) {
        if self.0.as_ref().is_none_or(|(b, _)| here.beats(b)) {
            self.0 = Some((here, at));
        }
    }

    fn or(self, fallback: P) -> (Rank, P) {
        self.0.unwrap_or((Rank::LEAST, fallback))
    }
}

/// The coarse samples of a round section, in scan order: `n` angles from φ = 0 at each radius
/// of its scan (the outer surface first, then through the wall of a tube).
fn round_grid(s: &Round, n: usize) -> impl Iterator<Item = (f64, f64)> {
    let step = 2.0 * PI / n as f64;
    s.scan_radii()
        .into_iter()
        .flat_map(move |r| (0..n).map(move |j| (step * j as f64, r)))
}

impl Section {
    /// Samples the perimeter (`samples` points on each path, at least 8) and refines the highest
    /// von Mises and principal stress between samples by golden-section search; a tube is also
    /// scanned through its wall at nine radii and refined in r. Both maxima start from the same
    /// samples.
    ///
    /// # Errors
    /// As [`stress_at`](Self::stress_at).
    pub fn scan(
        &self,
        loads: &Loads,
        pressure: &Pressure,
        k: Concentration,
        samples: usize,
    ) -> Result<Scan, SectionError> {
        let n = samples.max(8);
        match self {
            Self::Round(s) => self.scan_round(s, loads, pressure, k, n),
            Self::Rectangle(s) => self.scan_rectangle(s, loads, pressure, k, n),
        }
    }

    /// The point where `rank` is most severe (see [`Rank`]): the same samples as
    /// [`scan`](Self::scan), the best of them by severity with ties to the larger tie-breaker,
    /// then golden-section refinement around it (and through the wall of a tube). The returned
    /// `value` is the severity there.
    ///
    /// This ranks points by the decision being made, e.g. severity = 1/n for a factor of safety
    /// and tie = mean stress, so that of two equally loaded fibres the tensile one governs.
    ///
    /// # Errors
    /// As [`stress_at`](Self::stress_at).
    pub fn governing(
        &self,
        loads: &Loads,
        pressure: &Pressure,
        k: Concentration,
        samples: usize,
        rank: &dyn Fn(&StressTensor) -> Rank,
    ) -> Result<Critical, SectionError> {
        let n = samples.max(8);
        match self {
            Self::Round(s) => {
                let mut best = Best::new();
                for (phi, r) in round_grid(s, n) {
                    let t = self.stress_at(loads, pressure, k, Location::Round { phi, r })?;
                    best.offer(rank(&t), (phi, r));
                }
                self.refine_round(s, (loads, pressure, k), n, rank, best.or((0.0, s.ro)))
            }
            Self::Rectangle(s) => {
                let mut best = Best::new();
                for pos in s.scan_positions(n) {
                    let t = self.stress_at(loads, pressure, k, s.location_at(pos))?;
                    best.offer(rank(&t), pos);
                }
                self.refine_rectangle(s, (loads, pressure, k), n, rank, best.or(0.0))
            }
        }
    }

    /// Refines the best coarse sample `(first, (φ, r))` of a round section: three rounds of
    /// golden-section search in φ within a sample step, then (in a tube) in r within an eighth
    /// of the wall, with both surfaces as candidates.
    fn refine_round(
        &self,
        s: &Round,
        (loads, p, k): (&Loads, &Pressure, Concentration),
        n: usize,
        rank: &dyn Fn(&StressTensor) -> Rank,
        (first, (mut phi, mut r)): (Rank, (f64, f64)),
    ) -> Result<Critical, SectionError> {
        let at = |phi: f64, r: f64| self.stress_at(loads, p, k, Location::Round { phi, r });
        let severity = |phi: f64, r: f64| Ok(rank(&at(phi, r)?).severity_or_least());
        let step = 2.0 * PI / n as f64;
        let mut value = first.severity_or_least();
        for _ in 0..3 {
            let (x, v) = golden_max(phi - step, phi + step, |f| severity(f, r))?;
            if v > value {
                (phi, value) = (x, v);
            }
            if s.ri > 0.0 {
                let h = (s.ro - s.ri) / 8.0;
                let (lo, hi) = ((r - h).max(s.ri), (r + h).min(s.ro));
                let (x, v) = golden_max(lo, hi, |rr| severity(phi, rr))?;
                if v > value {
                    (r, value) = (x, v);
                }
                // The surfaces themselves are candidates (a maximum is often on one).
                for edge in [s.ri, s.ro] {
                    let v = severity(phi, edge)?;
                    if v > value {
                        (r, value) = (edge, v);
                    }
                }
            }
        }
        let phi = fmath::wrap(phi, 2.0 * PI);
        Ok(Critical {
            at: Location::Round { phi, r },
            position: phi,
            value,
        })
    }

    /// Refines the best coarse sample `(first, s)` of a rectangle by golden-section search
    /// within a sample step along the perimeter.
    fn refine_rectangle(
        &self,
        s: &Rectangle,
        (loads, p, k): (&Loads, &Pressure, Concentration),
        n: usize,
        rank: &dyn Fn(&StressTensor) -> Rank,
        (first, start): (Rank, f64),
    ) -> Result<Critical, SectionError> {
        let len = s.perimeter();
        let step = len / n as f64;
        let (x, v) = golden_max(start - step, start + step, |pos| {
            let t = self.stress_at(loads, p, k, s.location_at(pos))?;
            Ok(rank(&t).severity_or_least())
        })?;
        let (pos, value) = if v > first.severity_or_least() {
            (fmath::wrap(x, len), v)
        } else {
            (fmath::wrap(start, len), first.severity_or_least())
        };
        Ok(Critical {
            at: s.location_at(pos),
            position: pos,
            value,
        })
    }

    fn scan_round(
        &self,
        s: &Round,
        loads: &Loads,
        p: &Pressure,
        k: Concentration,
        n: usize,
    ) -> Result<Scan, SectionError> {
        // One pass over the grid: the curves along the surfaces are its rows there, and both
        // maxima start from its best samples.
        let mut outer = Vec::with_capacity(n);
        let mut bore = Vec::new();
        let (mut best_vm, mut best_s1) = (Best::new(), Best::new());
        for (phi, r) in round_grid(s, n) {
            let (von_mises, sigma1) =
                measures(&self.stress_at(loads, p, k, Location::Round { phi, r })?);
            let sample = Sample {
                position: phi,
                von_mises,
                sigma1,
            };
            if r == s.ro {
                outer.push(sample);
            } else if r == s.ri {
                bore.push(sample);
            }
            best_vm.offer(
                Rank {
                    severity: von_mises,
                    tie: 0.0,
                },
                (phi, r),
            );
            best_s1.offer(
                Rank {
                    severity: sigma1,
                    tie: 0.0,
                },
                (phi, r),
            );
        }
        let mut curves = alloc::vec![Curve {
            path: Path::Outer,
            samples: outer,
        }];
        if s.ri > 0.0 {
            curves.push(Curve {
                path: Path::Bore,
                samples: bore,
            });
        }
        let lkp = (loads, p, k);
        Ok(Scan {
            curves,
            max_von_mises: self.refine_round(s, lkp, n, &by_von_mises, best_vm.or((0.0, s.ro)))?,
            max_principal: self.refine_round(s, lkp, n, &by_sigma1, best_s1.or((0.0, s.ro)))?,
        })
    }

    fn scan_rectangle(
        &self,
        s: &Rectangle,
        loads: &Loads,
        p: &Pressure,
        k: Concentration,
        n: usize,
    ) -> Result<Scan, SectionError> {
        let len = s.perimeter();
        let mut samples = Vec::new();
        let (mut best_vm, mut best_s1) = (Best::new(), Best::new());
        for pos in s.scan_positions(n) {
            let (von_mises, sigma1) = measures(&self.stress_at(loads, p, k, s.location_at(pos))?);
            samples.push(Sample {
                position: pos,
                von_mises,
                sigma1,
            });
            best_vm.offer(
                Rank {
                    severity: von_mises,
                    tie: 0.0,
                },
                pos,
            );
            best_s1.offer(
                Rank {
                    severity: sigma1,
                    tie: 0.0,
                },
                pos,
            );
        }
        // Close the loop for the plot.
        if let Some(first) = samples.first().copied() {
            samples.push(Sample {
                position: len,
                ..first
            });
        }
        let lkp = (loads, p, k);
        Ok(Scan {
            max_von_mises: self.refine_rectangle(s, lkp, n, &by_von_mises, best_vm.or(0.0))?,
            max_principal: self.refine_rectangle(s, lkp, n, &by_sigma1, best_s1.or(0.0))?,
            curves: alloc::vec![Curve {
                path: Path::Perimeter,
                samples,
            }],
        })
    }
}

/// How severe a point is for a decision (larger is worse, e.g. 1/n for a factor of safety n),
/// and a tie-breaker (larger wins among equally severe points, e.g. the mean stress, so that a
/// tensile fibre beats an equally loaded compressive one).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Rank {
    /// Larger is worse. NaN counts as the least severe.
    pub severity: f64,
    /// Decides between severities within [`TIE_TOLERANCE`] of each other; larger wins.
    pub tie: f64,
}

/// Relative difference below which two severities are a tie (well above the round-off of
/// stresses at mirror-image points, far below any engineering difference).
pub const TIE_TOLERANCE: f64 = 1e-9;

impl Rank {
    const LEAST: Rank = Rank {
        severity: f64::MIN,
        tie: f64::MIN,
    };

    fn severity_or_least(&self) -> f64 {
        if self.severity.is_nan() {
            f64::MIN
        } else {
            self.severity.clamp(f64::MIN, f64::MAX)
        }
    }

    /// Whether this point is more severe than `other`, ties going to the larger tie-breaker.
    #[must_use]
    pub fn beats(&self, other: &Rank) -> bool {
        let (a, b) = (self.severity_or_least(), other.severity_or_least());
        let scale = a.abs().max(b.abs());
        if (a - b).abs() <= TIE_TOLERANCE * scale {
            self.tie > other.tie
        } else {
            a > b
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::equivalent::Equivalent;
    use crate::section::Face;
    use crate::vessel::Ends;
    use proptest::prelude::*;

    #[test]
    fn governing_breaks_a_tie_towards_tension_and_follows_the_ranking() {
        // Ø40 mm shaft, Mz = 1 kN·m, T = 1.5 kN·m: the fibres at φ = 0 and 180° carry equal and
        // opposite bending stress 32M/(πd³) with the same torsion shear 16T/(πd³) (Gere &
        // Goodno §3.3, §5.5, from memory), so their von Mises stresses are equal.
        let sec = Section::Round(Round::solid(0.04).unwrap());
        let l = Loads {
            mz: 1000.0,
            t: 1500.0,
            ..Loads::default()
        };
        let k = Concentration::default();
        let mean = |t: &StressTensor| (t.sx() + t.sy() + t.sz()) / 3.0;
        let vm = |t: &StressTensor| Rank {
            severity: Equivalent::of(t).von_mises,
            tie: mean(t),
        };
        let g = sec.governing(&l, &Pressure::NONE, k, 72, &vm).unwrap();
        let t = sec.stress_at(&l, &Pressure::NONE, k, g.at).unwrap();
        let d3 = 0.04_f64.powi(3);
        let sigma = 32.0 * 1000.0 / (PI * d3);
        assert!((t.sx() - sigma).abs() < 1e-6 * sigma, "{t:?}");
        // The opposite tie-breaker picks the compressive fibre.
        let vm_c = |t: &StressTensor| Rank {
            severity: Equivalent::of(t).von_mises,
            tie: -mean(t),
        };
        let g = sec.governing(&l, &Pressure::NONE, k, 72, &vm_c).unwrap();
        let t = sec.stress_at(&l, &Pressure::NONE, k, g.at).unwrap();
        assert!((t.sx() + sigma).abs() < 1e-6 * sigma, "{t:?}");
        // A ranking that penalises compression (no tie) finds the tensile fibre on its own.
        let s1 = |t: &StressTensor| Rank {
            severity: principal_values(t)[0],
            tie: 0.0,
        };
        let g = sec.governing(&l, &Pressure::NONE, k, 72, &s1).unwrap();
        let t = sec.stress_at(&l, &Pressure::NONE, k, g.at).unwrap();
        assert!(t.sx() > 0.0);
        // The scan's von Mises maximum is the governing point of a von Mises ranking.
        let scan = sec.scan(&l, &Pressure::NONE, k, 72).unwrap();
        assert!((scan.max_von_mises.value - Equivalent::of(&t).von_mises).abs() < 1e-6 * sigma);
    }

    proptest! {
        // Each case runs three full searches (slow in a debug build).
        #![proptest_config(ProptestConfig::with_cases(32))]
        #[test]
        fn the_scan_finds_what_separate_searches_find(
            ri in 0.0..25.0f64, mz in -1e6..1e6f64, my in -1e6..1e6f64, t in -1e6..1e6f64,
            vy in -1e5..1e5f64, p in 0.0..100.0f64, rect in any::<bool>(), samples in 8usize..40,
        ) {
            // One pass over the samples for the curves and both maxima must find exactly what
            // a search per measure finds, and the curves must be the stresses on the surfaces.
            let sec = if rect {
                Section::Rectangle(Rectangle::new(40.0, 25.0).unwrap())
            } else if ri > 1.0 {
                Section::Round(Round::tube(60.0, 2.0 * ri).unwrap())
            } else {
                Section::Round(Round::solid(60.0).unwrap())
            };
            let pr = match sec {
                Section::Round(r) if r.ri > 0.0 => Pressure { inner: p, outer: 0.0, ends: Ends::Closed, nu: 0.3 },
                _ => Pressure::NONE,
            };
            let (loads, k) = (Loads { mz, my, t, vy, ..Loads::default() }, Concentration::default());
            let scan = sec.scan(&loads, &pr, k, samples).unwrap();
            let vm = sec.governing(&loads, &pr, k, samples, &by_von_mises).unwrap();
            let s1 = sec.governing(&loads, &pr, k, samples, &by_sigma1).unwrap();
            prop_assert_eq!(scan.max_von_mises, vm);
            prop_assert_eq!(scan.max_principal, s1);
            for c in &scan.curves {
                for x in &c.samples {
                    let at = match (c.path, sec) {
                        (Path::Outer, Section::Round(r)) => Location::Round { phi: x.position, r: r.ro },
                        (Path::Bore, Section::Round(r)) => Location::Round { phi: x.position, r: r.ri },
                        (_, Section::Rectangle(r)) => r.location_at(x.position),
                        _ => unreachable!(),
                    };
                    let (v, s) = measures(&sec.stress_at(&loads, &pr, k, at).unwrap());
                    prop_assert_eq!((x.von_mises, x.sigma1), (v, s));
                    // σvm from J2 alone is the von Mises of every measure.
                    let e = Equivalent::of(&sec.stress_at(&loads, &pr, k, at).unwrap());
                    prop_assert_eq!(x.von_mises, e.von_mises);
                }
            }
        }
    }

    proptest! {
        #[test]
        fn the_scan_never_misses_the_combined_bending_and_torsion_maximum(
            d in 5.0..200.0f64, my in -1e6..1e6f64, mz in -1e6..1e6f64, t in -1e6..1e6f64, samples in 8usize..40,
        ) {
            let s = Section::Round(Round::solid(d).unwrap());
            let scan = s.scan(&Loads { my, mz, t, ..Loads::default() }, &Pressure::NONE, Concentration::default(), samples).unwrap();
            // Analytic: σ = 32M/(πd³) with M = √(My² + Mz²), τ = 16T/(πd³), σvm = √(σ² + 3τ²) and
            // σ1 = σ/2 + √((σ/2)² + τ²) at the fibre of greatest bending (Shigley §7-4, from memory).
            let d3 = PI * d * d * d;
            let sig = 32.0 * my.hypot(mz) / d3;
            let tau = 16.0 * t / d3;
            let vm = (sig * sig + 3.0 * tau * tau).sqrt();
            let s1 = sig / 2.0 + ((sig / 2.0).powi(2) + tau * tau).sqrt();
            prop_assert!((scan.max_von_mises.value - vm).abs() <= 1e-9 * vm + 1e-12, "{} vs {vm}", scan.max_von_mises.value);
            prop_assert!((scan.max_principal.value - s1).abs() <= 1e-9 * s1 + 1e-12, "{} vs {s1}", scan.max_principal.value);
        }

        #[test]
        fn the_rectangle_scan_finds_bending_plus_torsion_at_mid_long_face(
            h in 5.0..50.0f64, ratio in 1.0..6.0f64, mz in -1e6..1e6f64, t in -1e6..1e6f64, samples in 8usize..40,
        ) {
            // Long faces ±y carry both the greatest bending stress (6Mz/(bh²)) and the greatest
            // torsion shear (mid-face), so the maximum is √(σ² + 3τ²) there.
            let r = Rectangle::new(h, h * ratio).unwrap();
            let sec = Section::Rectangle(r);
            let loads = Loads { mz, t, ..Loads::default() };
            let scan = sec.scan(&loads, &Pressure::NONE, Concentration::default(), samples).unwrap();
            let sig = 6.0 * mz.abs() / (h * ratio * h * h);
            let tau = sec.stress_at(&loads, &Pressure::NONE, Concentration::default(), Location::Rectangle { face: Face::PosY, along: 0.0 }).unwrap().txy();
            let vm = (sig * sig + 3.0 * tau * tau).sqrt();
            prop_assert!((scan.max_von_mises.value - vm).abs() <= 1e-7 * vm + 1e-9, "{} vs {vm}", scan.max_von_mises.value);
        }

        #[test]
        fn the_tube_scan_covers_the_wall(
            p in 1.0..200.0f64, t in -1e6..1e6f64, m in -1e6..1e6f64,
        ) {
            let tube = Round::tube(60.0, 30.0).unwrap();
            let sec = Section::Round(tube);
            let pr = Pressure { inner: p, outer: 0.0, ends: Ends::Closed, nu: 0.3 };
            let loads = Loads { t, mz: m, ..Loads::default() };
            let scan = sec.scan(&loads, &pr, Concentration::default(), 24).unwrap();
            // No point of a fine (φ, r) grid beats the scan's maximum.
            let mut best = f64::NEG_INFINITY;
            for i in 0..=40 {
                for j in 0..180 {
                    let r = 15.0 + 15.0 * f64::from(i) / 40.0;
                    let phi = 2.0 * PI * f64::from(j) / 180.0;
                    let s = sec.stress_at(&loads, &pr, Concentration::default(), Location::Round { phi, r }).unwrap();
                    best = best.max(Equivalent::of(&s).von_mises);
                }
            }
            prop_assert!(scan.max_von_mises.value >= best * (1.0 - 1e-9), "{} < {best}", scan.max_von_mises.value);
        }
    }
}
