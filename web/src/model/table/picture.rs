//! What the table's two pictures draw, reduced to a few hundred numbers however many rows there
//! are: a measure against the line in the file (or time) as its least and greatest value in
//! each pixel column, and a histogram of the measure. Data reduction only; no stress formula.

/// A measure against x, one (least, greatest) pair per pixel column.
#[derive(Debug, Clone, PartialEq)]
pub struct Trace {
    /// x of the left edge of the first column and the right edge of the last.
    pub x: (f64, f64),
    /// Least and greatest finite value in each column (`None`: no point falls there).
    pub columns: Vec<Option<(f64, f64)>>,
    /// Least and greatest finite value of all.
    pub range: Option<(f64, f64)>,
    /// Points with a value that is not finite (not drawn): NaN, or an infinite factor.
    pub not_drawn: usize,
}

/// Reduces the points (`x[i]`, `values[i]`) to `width` columns spanning the points' x (the
/// shorter slice sets the count).
///
/// Plain loops over slices with comparisons (no `f64::min`, a call per number in the page's
/// wasm): a million points take milliseconds in the page, which is built for size.
#[must_use]
pub fn trace(x: &[f64], values: &[f64], width: usize) -> Trace {
    let n = x.len().min(values.len());
    let (x, values) = (&x[..n], &values[..n]);
    let (mut lo, mut hi) = (f64::INFINITY, f64::NEG_INFINITY);
    for &x in x {
        if x.is_finite() {
            if x < lo {
                lo = x;
            }
            if x > hi {
                hi = x;
            }
        }
    }
    let width = width.max(1);
    if lo > hi {
        return Trace {
            x: (0.0, 1.0),
            columns: vec![None; width],
            range: None,
            not_drawn: n,
        };
    }
    // A single x still gets a span, so every point lands in a column.
    let span = if hi > lo { hi - lo } else { 1.0 };
    let mut least = vec![f64::INFINITY; width];
    let mut greatest = vec![f64::NEG_INFINITY; width];
    let mut not_drawn = 0;
    for (&x, &v) in x.iter().zip(values) {
        if !(v.is_finite() && x.is_finite()) {
            not_drawn += 1;
            continue;
        }
        let at = (((x - lo) / span * width as f64) as usize).min(width - 1);
        if v < least[at] {
            least[at] = v;
        }
        if v > greatest[at] {
            greatest[at] = v;
        }
    }
    let columns: Vec<Option<(f64, f64)>> = least
        .iter()
        .zip(&greatest)
        .map(|(&a, &b)| (a <= b).then_some((a, b)))
        .collect();
    let range = columns.iter().flatten().fold(None, |r, &(a, b)| {
        Some(r.map_or((a, b), |(lo, hi): (f64, f64)| {
            (if a < lo { a } else { lo }, if b > hi { b } else { hi })
        }))
    });
    Trace {
        x: (lo, lo + span),
        columns,
        range,
        not_drawn,
    }
}

/// Counts of a measure in equal bins.
#[derive(Debug, Clone, PartialEq)]
pub struct Histogram {
    /// The bins' span: the least finite value, and the greatest (or the cap).
    pub span: (f64, f64),
    /// Points in each bin (the last bin holds its right edge).
    pub counts: Vec<usize>,
    /// Points above the cap, counted beside the bins.
    pub above: usize,
    /// Points with a value that is not finite.
    pub not_finite: usize,
}

/// The values in `bins` equal bins from the least to the greatest finite value, or to `cap`
/// when values go beyond it (a factor of safety of 10⁶ at a lightly loaded row would squeeze
/// the rest into one bin). Plain loops, as [`trace`].
#[must_use]
pub fn histogram(values: &[f64], bins: usize, cap: Option<f64>) -> Histogram {
    let cap = cap.filter(|c| c.is_finite()).unwrap_or(f64::INFINITY);
    let (mut lo, mut hi) = (f64::INFINITY, f64::NEG_INFINITY);
    let (mut above, mut not_finite) = (0, 0);
    for &v in values {
        if !v.is_finite() {
            not_finite += 1;
        } else if v > cap {
            above += 1;
        } else {
            if v < lo {
                lo = v;
            }
            if v > hi {
                hi = v;
            }
        }
    }
    let bins = bins.max(1);
    let mut counts = vec![0; bins];
    if lo > hi {
        return Histogram {
            span: (0.0, 1.0),
            counts,
            above,
            not_finite,
        };
    }
    let width = if hi > lo { hi - lo } else { 1.0 };
    for &v in values {
        if v.is_finite() && v <= cap {
            let at = ((v - lo) / width * bins as f64) as usize;
            counts[at.min(bins - 1)] += 1;
        }
    }
    Histogram {
        span: (lo, lo + width),
        counts,
        above,
        not_finite,
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use proptest::prelude::*;

    proptest! {
        #[test]
        fn every_finite_point_is_in_one_column_and_the_extremes_are_kept(
            pts in proptest::collection::vec((-1e3f64..1e3, prop_oneof![-1e6f64..1e6, Just(f64::NAN), Just(f64::INFINITY)]), 0..300),
            width in 1usize..50,
        ) {
            let (xs, vs): (Vec<f64>, Vec<f64>) = pts.iter().copied().unzip();
            let t = trace(&xs, &vs, width);
            prop_assert_eq!(t.columns.len(), width);
            let finite: Vec<f64> = pts.iter().map(|p| p.1).filter(|v| v.is_finite()).collect();
            prop_assert_eq!(t.not_drawn, pts.len() - finite.len());
            let lo = finite.iter().copied().fold(f64::INFINITY, f64::min);
            let hi = finite.iter().copied().fold(f64::NEG_INFINITY, f64::max);
            prop_assert_eq!(t.range, (!finite.is_empty()).then_some((lo, hi)));
            // Each column's extremes are those of the points whose x falls in it.
            let col = |x: f64| (((x - t.x.0) / (t.x.1 - t.x.0) * width as f64) as usize).min(width - 1);
            for (j, c) in t.columns.iter().enumerate() {
                let own: Vec<f64> = pts.iter().filter(|p| p.1.is_finite() && col(p.0) == j).map(|p| p.1).collect();
                let want = (!own.is_empty()).then(|| (
                    own.iter().copied().fold(f64::INFINITY, f64::min),
                    own.iter().copied().fold(f64::NEG_INFINITY, f64::max),
                ));
                prop_assert_eq!(*c, want);
            }
        }

        #[test]
        fn a_histogram_counts_every_point_once(
            vs in proptest::collection::vec(prop_oneof![-1e3f64..1e3, Just(f64::NAN), Just(f64::INFINITY)], 0..300),
            bins in 1usize..40,
            cap in prop_oneof![Just(None), (0.0f64..500.0).prop_map(Some)],
        ) {
            let h = histogram(&vs, bins, cap);
            prop_assert_eq!(h.counts.iter().sum::<usize>() + h.above + h.not_finite, vs.len());
            prop_assert_eq!(h.not_finite, vs.iter().filter(|v| !v.is_finite()).count());
        }
    }

    #[test]
    fn a_histogram_agrees_with_numpy() {
        // numpy.histogram([1, 2, 2, 3, 4, 10], bins=3) → counts [4, 1, 1], edges 1, 4, 7, 10
        // (equal bins over [min, max], the last one closed; values printed by numpy on this machine).
        let h = histogram(&[1.0, 2.0, 2.0, 3.0, 4.0, 10.0], 3, None);
        assert_eq!((h.span, h.counts), ((1.0, 10.0), vec![4, 1, 1]));
        // numpy.histogram([0.1, 0.2, 0.3, 0.7, 0.9, 1.0, 0.35], bins=5) → [2, 2, 0, 1, 2].
        let h = histogram(&[0.1, 0.2, 0.3, 0.7, 0.9, 1.0, 0.35], 5, None);
        assert_eq!(h.counts, vec![2, 2, 0, 1, 2]);
    }
}
