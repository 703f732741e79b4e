//! The life panel's drawings as data: the S–N diagram on log-log axes with the line, the
//! endurance limit and the cycles, the cycle matrix and the damage in each range bin.
//! Presentation only: every stress, life and damage comes from core through the outcome.

use crate::model::judge::{HistoryOutcome, LifeOutcome, LifeResult};
use crate::model::numfmt::{format_sig, superscript};
use std::collections::BTreeSet;
use stresscase_core::mean_stress::Reversed;
use stresscase_core::rainflow::CycleMatrix;
use stresscase_core::sn_curve::{Life, LOW_CYCLE_END};

/// Drawing width on a wide screen and on a phone (SVG units, drawn at about 1 unit per pixel so
/// the text stays readable), and the height.
pub const W_WIDE: f64 = 460.0;
/// On a phone.
pub const W_NARROW: f64 = 340.0;
/// Height.
pub const H: f64 = 300.0;
/// Margins.
pub const LEFT: f64 = 56.0;
/// Right margin.
pub const RIGHT: f64 = 12.0;
/// Top margin.
pub const TOP: f64 = 12.0;
/// Bottom margin.
pub const BOTTOM: f64 = 40.0;
/// Bins along each axis of the cycle matrix.
pub const BINS: usize = 10;

/// The S–N diagram as data.
#[derive(Debug, Clone, PartialEq)]
pub struct SnPicture {
    /// Plot area: left, top, right, bottom.
    pub frame: (f64, f64, f64, f64),
    /// Ticks along N (pixel x, label) and along σar (pixel y, label).
    pub ticks_n: Vec<(f64, String)>,
    /// Ticks along σar.
    pub ticks_s: Vec<(f64, String)>,
    /// The line from 10³ cycles to its knee (or the frame).
    pub line: String,
    /// The endurance limit from the knee to the right edge.
    pub endurance: Option<String>,
    /// One small square per cycle drawn (at the right edge when it does no damage).
    pub marks: String,
    /// Cycles drawn.
    pub points: usize,
    /// Pixel x of 10³ cycles: left of it is low-cycle fatigue.
    pub low_cycle_x: f64,
}

/// 1-2-5 values in each decade between `lo` and `hi` (both > 0).
fn log_ticks(lo: f64, hi: f64) -> Vec<f64> {
    let mut out = Vec::new();
    let mut decade = 10f64.powf(lo.log10().floor());
    while decade <= hi {
        for m in [1.0, 2.0, 5.0] {
            let v = m * decade;
            if v >= lo && v <= hi {
                out.push(v);
            }
        }
        decade *= 10.0;
    }
    out
}

/// Builds the S–N diagram of a life outcome, with the cycles of `history` when the life is of
/// a history.
#[must_use]
pub fn sn_picture(l: &LifeOutcome, history: Option<&HistoryOutcome>, w: f64) -> SnPicture {
    // Each cycle as (σar, life); cycles without an amplitude are not drawn.
    let cycles: Vec<(f64, Life)> = match (&l.result, history) {
        (LifeResult::Cycle(c), _) => match c.reversed {
            Reversed::Amplitude(a) => vec![(a, l.line.life(a))],
            _ => Vec::new(),
        },
        (_, None) => Vec::new(),
        (_, Some(h)) => h
            .cycles
            .iter()
            .filter_map(
                |c| match l.mean_stress.reversed(c.amplitude(), c.mean, l.sut) {
                    Reversed::Amplitude(a) if a > 0.0 => Some((a, l.line.life(a))),
                    _ => None,
                },
            )
            .collect(),
    };
    let longest = cycles
        .iter()
        .filter_map(|(_, life)| match life {
            Life::Cycles(n) => Some(*n),
            _ => None,
        })
        .fold(1e7, f64::max);
    let (n_lo, n_hi) = (2.0, longest.log10().ceil().clamp(7.0, 12.0));
    let top = l.line.amplitude_at(10f64.powf(n_lo));
    let knee_s = l
        .line
        .endurance
        .unwrap_or_else(|| l.line.amplitude_at(10f64.powf(n_hi)));
    let s_min = cycles.iter().map(|c| c.0).fold(knee_s, f64::min) / 1.3;
    let s_max = cycles.iter().map(|c| c.0).fold(top, f64::max) * 1.3;
    let (s_lo, s_hi) = (s_min.log10(), s_max.log10());
    let frame = (LEFT, TOP, w - RIGHT, H - BOTTOM);
    let x = |n: f64| frame.0 + (frame.2 - frame.0) * (n.log10() - n_lo) / (n_hi - n_lo);
    let y = |s: f64| frame.3 - (frame.3 - frame.1) * (s.log10() - s_lo) / (s_hi - s_lo);
    let knee_n = match l.line.endurance {
        Some(e) => match l.line.life(e * (1.0 + 1e-12)) {
            Life::Cycles(n) => n.min(10f64.powf(n_hi)),
            _ => 10f64.powf(n_hi),
        },
        None => 10f64.powf(n_hi),
    };
    let line = format!(
        "{:.2},{:.2} {:.2},{:.2}",
        x(LOW_CYCLE_END),
        y(l.line.amplitude_at(LOW_CYCLE_END)),
        x(knee_n),
        y(l.line.amplitude_at(knee_n))
    );
    let endurance = l
        .line
        .endurance
        .map(|e| format!("{:.2},{:.2} {:.2},{:.2}", x(knee_n), y(e), frame.2, y(e)));
    let size = if cycles.len() == 1 { 4.0 } else { 1.5 };
    let mut seen = BTreeSet::new();
    let mut marks = String::new();
    for (s, life) in &cycles {
        let px = match life {
            Life::Cycles(n) => x(*n),
            Life::Infinite => frame.2 - size,
            Life::LowCycle => x(10f64.powf(2.5)),
        };
        let key = ((px * 2.0).round() as i64, (y(*s) * 2.0).round() as i64);
        if seen.insert(key) {
            marks.push_str(&format!(
                "M{:.1},{:.1}h{}v{}h-{}z",
                px - size,
                y(*s) - size,
                2.0 * size,
                2.0 * size,
                2.0 * size
            ));
        }
    }
    let ticks_n = (n_lo as i32..=n_hi as i32)
        .map(|k| (x(10f64.powi(k)), format!("10{}", superscript(k))))
        .collect();
    let ticks_s = log_ticks(s_min, s_max)
        .into_iter()
        .map(|v| (y(v), format_sig(v, 3)))
        .collect();
    SnPicture {
        frame,
        ticks_n,
        ticks_s,
        line,
        endurance,
        marks,
        points: cycles.len(),
        low_cycle_x: x(LOW_CYCLE_END),
    }
}

/// One shaded cell or bar.
#[derive(Debug, Clone, PartialEq)]
pub struct Cell {
    /// Left.
    pub x: f64,
    /// Top.
    pub y: f64,
    /// Width.
    pub w: f64,
    /// Height.
    pub h: f64,
    /// Fill opacity, 0–1 (cells only).
    pub shade: f64,
    /// Hover text.
    pub title: String,
}

fn bin_span(lo: f64, hi: f64, n: usize, i: usize) -> (f64, f64) {
    let w = (hi - lo) / n as f64;
    (lo + w * i as f64, lo + w * (i + 1) as f64)
}

/// The non-empty cells of a count matrix: range up, mean across.
#[must_use]
pub fn matrix_cells(m: &CycleMatrix, w: f64) -> Vec<Cell> {
    let most = m.cells.iter().copied().fold(0.0, f64::max);
    let (pw, ph) = (
        (w - LEFT - RIGHT) / m.means as f64,
        (H - TOP - BOTTOM) / m.ranges as f64,
    );
    let mut out = Vec::new();
    for r in 0..m.ranges {
        for k in 0..m.means {
            let v = m.cells[r * m.means + k];
            if v <= 0.0 {
                continue;
            }
            let (r0, r1) = bin_span(0.0, m.range_max, m.ranges, r);
            let (m0, m1) = bin_span(m.mean_span.0, m.mean_span.1, m.means, k);
            out.push(Cell {
                x: LEFT + pw * k as f64,
                y: H - BOTTOM - ph * (r + 1) as f64,
                w: pw,
                h: ph,
                shade: 0.15 + 0.85 * v / most,
                title: format!(
                    "{} cycles: range {} to {}, mean {} to {}",
                    format_sig(v, 6),
                    format_sig(r0, 4),
                    format_sig(r1, 4),
                    format_sig(m0, 4),
                    format_sig(m1, 4)
                ),
            });
        }
    }
    out
}

/// One bar per range bin of a damage matrix (one mean bin), as its share of the total.
#[must_use]
pub fn bin_bars(m: &CycleMatrix, w: f64) -> Vec<Cell> {
    let total: f64 = m.cells.iter().sum();
    if total <= 0.0 {
        return Vec::new();
    }
    let pw = (w - LEFT - RIGHT) / m.ranges as f64;
    let ph = H - TOP - BOTTOM;
    (0..m.ranges)
        .filter(|&r| m.cells[r * m.means..(r + 1) * m.means].iter().sum::<f64>() > 0.0)
        .map(|r| {
            let d: f64 = m.cells[r * m.means..(r + 1) * m.means].iter().sum();
            let (r0, r1) = bin_span(0.0, m.range_max, m.ranges, r);
            let h = ph * d / total;
            Cell {
                x: LEFT + pw * r as f64 + 1.0,
                y: H - BOTTOM - h,
                w: pw - 2.0,
                h,
                shade: 1.0,
                title: format!(
                    "range {} to {}: D = {} ({} % of the total)",
                    format_sig(r0, 4),
                    format_sig(r1, 4),
                    format_sig(d, 4),
                    format_sig(100.0 * d / total, 3)
                ),
            }
        })
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn log_ticks_step_one_two_five() {
        assert_eq!(log_ticks(80.0, 600.0), vec![100.0, 200.0, 500.0]);
    }
}
