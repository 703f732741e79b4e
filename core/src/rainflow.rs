//! Rainflow counting of a load history: its turning points, then closed cycles and half cycles.
//!
//! Source: ASTM E1049-85 (reapproved 2017), *Standard Practices for Cycle Counting in Fatigue
//! Analysis*, §5.4.4, the three-point rainflow method (from memory):
//! 1. reduce the history to its turning points (peaks and valleys). Here a run of equal values
//!    counts once (its first sample), and the first and last points are always kept;
//! 2. the starting point S is the history's first point (not its largest);
//! 3. with X the most recent range and Y the range before it (the three most recent points not
//!    yet discarded): if X < Y read the next point; otherwise, if Y contains S, count Y as a half
//!    cycle, discard its first point and move S to its second; else count Y as one cycle and
//!    discard both of its points; then compare again;
//! 4. at the end, every range left is counted as a half cycle.
//!
//! A cycle's range is |a − b| ≥ 0 and its mean (a + b)/2, in the history's unit. Counting is
//! linear in the history's length; its memory is the turning points and the cycles.

use alloc::vec::Vec;
use core::fmt;

/// One counted cycle or half cycle.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct RainflowCycle {
    /// Range |a − b| (≥ 0).
    pub range: f64,
    /// Mean (a + b)/2.
    pub mean: f64,
    /// 1.0 for a closed cycle, 0.5 for a half cycle.
    pub count: f64,
    /// Index in the history of the range's first point.
    pub from: usize,
    /// Index in the history of the range's second point.
    pub to: usize,
}

impl RainflowCycle {
    /// Half the range: the cycle's amplitude.
    #[must_use]
    pub fn amplitude(&self) -> f64 {
        0.5 * self.range
    }
}

/// Why a history was refused.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum HistoryError {
    /// A value is NaN or infinite; its 0-based index.
    NonFinite(usize),
    /// A range between two values overflows the number range; the index of its second point.
    Overflow(usize),
}

impl fmt::Display for HistoryError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            Self::NonFinite(i) => write!(f, "value {} is not a finite number", i + 1),
            Self::Overflow(i) => write!(
                f,
                "the range ending at value {} overflows the number range; use a larger unit",
                i + 1
            ),
        }
    }
}

/// The turning points of `history` as (index, value): the first point, every peak and valley
/// (the first sample of a run of equal values), and the last point.
///
/// # Errors
/// [`HistoryError::NonFinite`] at the first NaN or infinite value.
pub fn turning_points(history: &[f64]) -> Result<Vec<(usize, f64)>, HistoryError> {
    let mut out = Vec::new();
    let Some(&first) = history.first() else {
        return Ok(out);
    };
    if !first.is_finite() {
        return Err(HistoryError::NonFinite(0));
    }
    out.push((0, first));
    // The latest distinct point and the direction that led to it (0 before the first move).
    let (mut last_i, mut last, mut rising) = (0usize, first, None::<bool>);
    for (i, &x) in history.iter().enumerate().skip(1) {
        if !x.is_finite() {
            return Err(HistoryError::NonFinite(i));
        }
        if x == last {
            continue;
        }
        let up = x > last;
        if rising.is_some_and(|r| r != up) {
            out.push((last_i, last));
        }
        (last_i, last, rising) = (i, x, Some(up));
    }
    if last_i != 0 {
        out.push((last_i, last));
    }
    Ok(out)
}

fn cycle(a: (usize, f64), b: (usize, f64), count: f64) -> Result<RainflowCycle, HistoryError> {
    let range = (a.1 - b.1).abs();
    if !range.is_finite() {
        return Err(HistoryError::Overflow(b.0));
    }
    Ok(RainflowCycle {
        range,
        mean: 0.5 * a.1 + 0.5 * b.1,
        count,
        from: a.0,
        to: b.0,
    })
}

/// Every cycle and half cycle of `history`, in the order the method counts them.
///
/// # Errors
/// [`HistoryError`] for a non-finite value or an overflowing range.
pub fn count(history: &[f64]) -> Result<Vec<RainflowCycle>, HistoryError> {
    let points = turning_points(history)?;
    let mut cycles = Vec::with_capacity(points.len() / 2 + 1);
    // Points not yet discarded; the first of them is always the starting point S.
    let mut stack: Vec<(usize, f64)> = Vec::with_capacity(64);
    for p in points {
        stack.push(p);
        while stack.len() >= 3 {
            let n = stack.len();
            let x = (stack[n - 1].1 - stack[n - 2].1).abs();
            let y = (stack[n - 2].1 - stack[n - 3].1).abs();
            if x < y {
                break;
            }
            if n == 3 {
                cycles.push(cycle(stack[0], stack[1], 0.5)?);
                stack.remove(0);
            } else {
                cycles.push(cycle(stack[n - 3], stack[n - 2], 1.0)?);
                stack.drain(n - 3..n - 1);
            }
        }
    }
    for w in stack.windows(2) {
        cycles.push(cycle(w[0], w[1], 0.5)?);
    }
    Ok(cycles)
}

/// A cycle matrix: `ranges × means` bins over the counted cycles' ranges and means, each bin
/// holding the sum of `weight(i)` over the cycles `i` that fall in it (their counts for a
/// count matrix, their damage for a damage matrix). Bins are equal in width; a cycle on a
/// bin's upper edge falls in that bin, and the last bin includes the greatest value.
#[derive(Debug, Clone, PartialEq)]
pub struct CycleMatrix {
    /// Bins along the range.
    pub ranges: usize,
    /// Bins along the mean.
    pub means: usize,
    /// The range axis: from 0 to the greatest range.
    pub range_max: f64,
    /// The mean axis: least and greatest mean.
    pub mean_span: (f64, f64),
    /// Row-major sums, `cells[r * means + m]`.
    pub cells: Vec<f64>,
}

impl CycleMatrix {
    /// Bins `cycles` into `ranges × means` cells (each at least 1) weighted by `weight`.
    #[must_use]
    pub fn of(
        cycles: &[RainflowCycle],
        ranges: usize,
        means: usize,
        weight: impl Fn(usize) -> f64,
    ) -> Self {
        let (ranges, means) = (ranges.max(1), means.max(1));
        let range_max = cycles.iter().map(|c| c.range).fold(0.0, f64::max);
        let (lo, hi) = cycles
            .iter()
            .fold((f64::INFINITY, f64::NEG_INFINITY), |(l, h), c| {
                (l.min(c.mean), h.max(c.mean))
            });
        let mean_span = if lo <= hi { (lo, hi) } else { (0.0, 0.0) };
        let bin = |v: f64, lo: f64, hi: f64, n: usize| -> usize {
            if hi <= lo {
                return 0;
            }
            let f = (v - lo) / (hi - lo) * n as f64;
            // Truncation is the binning; the float is in [0, n].
            #[allow(clippy::cast_possible_truncation, clippy::cast_sign_loss)]
            let k = crate::fmath::ceil(f).max(1.0) as usize - 1;
            k.min(n - 1)
        };
        let mut cells = alloc::vec![0.0; ranges * means];
        for (i, c) in cycles.iter().enumerate() {
            let r = bin(c.range, 0.0, range_max, ranges);
            let m = bin(c.mean, mean_span.0, mean_span.1, means);
            cells[r * means + m] += weight(i);
        }
        Self {
            ranges,
            means,
            range_max,
            mean_span,
            cells,
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use alloc::vec;
    use proptest::prelude::*;

    fn summary(cycles: &[RainflowCycle]) -> Vec<(f64, f64)> {
        let mut by_range: Vec<(f64, f64)> = Vec::new();
        for c in cycles {
            match by_range.iter_mut().find(|(r, _)| *r == c.range) {
                Some(e) => e.1 += c.count,
                None => by_range.push((c.range, c.count)),
            }
        }
        by_range.sort_by(|a, b| a.0.total_cmp(&b.0));
        by_range
    }

    #[test]
    fn the_standards_example_history_counts_as_published() {
        // ASTM E1049-85 §5.4.4 example (from memory): ranges 3: ½, 4: 1½, 6: ½, 8: 1, 9: ½.
        let h = [-2.0, 1.0, -3.0, 5.0, -1.0, 3.0, -4.0, 4.0, -2.0];
        let c = count(&h).unwrap();
        assert_eq!(
            summary(&c),
            vec![(3.0, 0.5), (4.0, 1.5), (6.0, 0.5), (8.0, 1.0), (9.0, 0.5)]
        );
        // The closed cycle of range 4 is E–F (values −1 and 3, indices 4 and 5).
        let full: Vec<_> = c.iter().filter(|c| c.count == 1.0).collect();
        assert_eq!((full[0].from, full[0].to, full[0].mean), (4, 5, 1.0));
    }

    #[test]
    fn turning_points_keep_ends_and_collapse_runs() {
        let tp = turning_points(&[1.0, 1.0, 3.0, 3.0, 2.0, 0.0, 0.0, 4.0, 5.0]).unwrap();
        assert_eq!(tp, vec![(0, 1.0), (2, 3.0), (5, 0.0), (8, 5.0)]);
        assert_eq!(turning_points(&[2.0, 2.0]).unwrap(), vec![(0, 2.0)]);
        assert!(turning_points(&[]).unwrap().is_empty());
        assert_eq!(
            turning_points(&[1.0, f64::NAN]),
            Err(HistoryError::NonFinite(1))
        );
        // Two points: one half cycle.
        assert_eq!(summary(&count(&[1.0, 4.0]).unwrap()), vec![(3.0, 0.5)]);
        assert_eq!(
            count(&[-f64::MAX, f64::MAX]),
            Err(HistoryError::Overflow(1))
        );
    }

    #[test]
    fn matrix_holds_every_cycle_once() {
        let c = count(&[-2.0, 1.0, -3.0, 5.0, -1.0, 3.0, -4.0, 4.0, -2.0]).unwrap();
        let m = CycleMatrix::of(&c, 4, 3, |i| c[i].count);
        let total: f64 = m.cells.iter().sum();
        assert_eq!(total, c.iter().map(|c| c.count).sum::<f64>());
        assert_eq!((m.range_max, m.mean_span), (9.0, (-1.0, 1.0)));
        // Range 9 and mean 0.5 sit in the last range bin and the middle mean bin.
        assert!(m.cells[3 * 3 + 2] > 0.0 || m.cells[3 * 3 + 1] > 0.0);
    }

    proptest! {
        #[test]
        fn every_turning_range_is_counted_once(h in prop::collection::vec(-1e3f64..1e3, 0..200)) {
            // A closed cycle discards two turning points and a half cycle one, and the k points
            // left at the end give k − 1 half cycles: the counts add up to (points − 1) halves.
            let tp = turning_points(&h).unwrap();
            let c = count(&h).unwrap();
            let halves: f64 = c.iter().map(|c| 2.0 * c.count).sum();
            prop_assert_eq!(halves as usize, tp.len().saturating_sub(1));
            for cy in &c {
                prop_assert!(cy.range >= 0.0 && cy.from < cy.to);
            }
        }

        #[test]
        fn a_mirrored_history_mirrors_the_means(h in prop::collection::vec(-1e3f64..1e3, 0..200)) {
            let neg: Vec<f64> = h.iter().map(|x| -x).collect();
            let (a, b) = (count(&h).unwrap(), count(&neg).unwrap());
            prop_assert_eq!(a.len(), b.len());
            for (p, q) in a.iter().zip(&b) {
                prop_assert_eq!((p.range, p.count, p.from, p.to), (q.range, q.count, q.from, q.to));
                prop_assert_eq!(p.mean, -q.mean);
            }
        }
    }
}
