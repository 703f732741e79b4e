//! The table's two pictures of the ranking measure: against the line in the file (or time,
//! when a column is marked as time), drawn as the least and greatest value in each pixel
//! column so a million rows draw as fast as a hundred; and a histogram. The case's allowable
//! for that measure is drawn on both when the criterion in use limits the measure on its own.

use super::reading::Loaded;
use super::worst_rows::{is_stress, measure_symbol};
use super::Outcome;
use crate::model::evaluation::Evaluation;
use crate::model::numfmt::format_sig;
use crate::model::table::picture::{histogram, trace};
use crate::model::table::ColumnKind;
use crate::panels::mohr_diagram::NarrowScreen;
use crate::panels::plot::{nice_ticks, tick_labels};
use core::fmt::Write as _;
use leptos::prelude::*;
use stresscase_core::criteria::Criterion;
use stresscase_core::points::{allowable, values_of, Measure};
use stresscase_core::StressUnit;

/// Drawing widths: on a wide screen two pictures side by side, on a phone one narrow picture,
/// so the text stays about 11 px where it is shown.
const W_WIDE: f64 = 640.0;
const W_NARROW: f64 = 340.0;
const H: f64 = 250.0;
const LEFT: f64 = 72.0;
const RIGHT: f64 = 36.0;
const TOP: f64 = 12.0;
const BOTTOM: f64 = 42.0;
const PLOT_H: f64 = H - TOP - BOTTOM;
/// Histogram bins.
const BINS: usize = 40;

/// The allowable of `by` for the case on screen, and how it is worked out.
fn allowable_of(e: &Evaluation, by: Measure) -> Option<(f64, &'static str)> {
    let j = &e.judgement;
    let a = allowable(by, j.in_use, &j.strengths, j.required)?;
    let words = match (by, j.in_use) {
        (Measure::Factor, _) => "the required factor",
        (Measure::TauMax, _) => "Sy/(2n)",
        (Measure::Sigma1, _) => "Sut/n",
        (Measure::Sigma3, _) => "−Suc/n",
        _ => "Sy/n",
    };
    Some((a, words))
}

/// The drawing's width for the screen it is on (tracked: a turned phone redraws).
fn drawing_width(narrow: Option<RwSignal<bool>>) -> f64 {
    if narrow.is_some_and(|n| n.get()) {
        W_NARROW
    } else {
        W_WIDE
    }
}

/// The allowable's label beside its line.
fn allowable_text(a: f64, by: Measure, unit: &str) -> String {
    if is_stress(by) {
        format!("allowable {} {unit}", format_sig(a, 4))
    } else {
        format!("required n = {}", format_sig(a, 4))
    }
}

/// What the case says of `by`: its allowable (and how it is worked out), and the criterion in
/// use; `None` while the case has a problem.
pub(super) type Limit = (Option<(f64, &'static str)>, Criterion);

/// The case's [`Limit`] for the ranking measure, as a memo: the pictures redraw when it
/// changes, not at every keystroke that leaves it as it was (typing a component changes the
/// evaluation, not the allowable).
pub(super) fn limit_of(
    shown: Memo<Option<Evaluation>>,
    ranking: Signal<Option<Measure>>,
) -> Memo<Option<Limit>> {
    Memo::new(move |_| {
        let by = ranking.get()?;
        shown.with(|e| {
            e.as_ref()
                .map(|e| (allowable_of(e, by), e.judgement.in_use))
        })
    })
}

/// The caption's sentence on the allowable line: its formula and value, or why there is none.
fn allowable_sentence(limit: Limit, by: Measure, unit: &str) -> String {
    match limit.0 {
        Some((a, words)) => format!(
            "Dashed: the allowable, {words} = {}{}.",
            format_sig(a, 4),
            if is_stress(by) {
                format!(" {unit}")
            } else {
                String::new()
            }
        ),
        None => no_allowable(by, limit.1),
    }
}

/// Why no allowable is drawn for `by`.
fn no_allowable(by: Measure, criterion: Criterion) -> String {
    format!(
        "No allowable line: {} does not limit {} on its own. Rank by the factor of safety to see every row against the required one.",
        criterion.name(),
        measure_symbol(by)
    )
}

/// A vertical range [lo, hi] holding `range` and `extra` (the allowable), padded a little.
fn y_span(range: Option<(f64, f64)>, extra: Option<f64>) -> (f64, f64) {
    let (mut lo, mut hi) = range.unwrap_or((0.0, 1.0));
    if let Some(a) = extra {
        lo = lo.min(a);
        hi = hi.max(a);
    }
    let pad = if hi > lo {
        0.05 * (hi - lo)
    } else {
        0.1 * hi.abs().max(1.0)
    };
    (lo - pad, hi + pad)
}

/// The axes: frame, grid and tick labels for x in `xs` and y in `ys`, and the axis names.
fn axes(w: f64, xs: (f64, f64), ys: (f64, f64), x_name: &str, y_name: &str) -> impl IntoView {
    let plot_w = w - LEFT - RIGHT;
    let px = move |x: f64| LEFT + (x - xs.0) / (xs.1 - xs.0) * plot_w;
    let py = move |y: f64| TOP + (ys.1 - y) / (ys.1 - ys.0) * PLOT_H;
    let xt = nice_ticks(xs.0, xs.1, if w < W_WIDE { 4 } else { 7 });
    let yt = nice_ticks(ys.0, ys.1, 6);
    let x_labels = tick_labels(&xt);
    let y_labels = tick_labels(&yt);
    view! {
        <rect class="plot-bg" x=LEFT y=TOP width=plot_w height=PLOT_H></rect>
        {yt.into_iter().zip(y_labels).map(|(v, t)| view! {
            <g class="tick">
                <line class="grid" x1=LEFT x2=LEFT + plot_w y1=py(v) y2=py(v)></line>
                <text x=LEFT - 5.0 y=py(v) + 4.0 text-anchor="end">{t}</text>
            </g>
        }).collect_view()}
        {xt.into_iter().zip(x_labels).map(|(v, t)| view! {
            <g class="tick">
                <text x=px(v) y=TOP + PLOT_H + 15.0 text-anchor="middle">{t}</text>
            </g>
        }).collect_view()}
        <text class="axis-label" x=LEFT + plot_w / 2.0 y=H - 6.0 text-anchor="middle">{x_name.to_string()}</text>
        <text class="axis-label" x=14.0 y=TOP + PLOT_H / 2.0 text-anchor="middle"
            transform=format!("rotate(-90 14 {})", TOP + PLOT_H / 2.0)>{y_name.to_string()}</text>
    }
}

/// The measure's axis name, with its unit.
fn y_name(by: Measure, unit: &str) -> String {
    if is_stress(by) {
        format!("{} ({unit})", measure_symbol(by))
    } else {
        format!("{} (–)", measure_symbol(by))
    }
}

/// The measure against the line in the file, or time (`table-trace`).
#[component]
pub fn MeasureTrace(
    case_unit: Memo<StressUnit>,
    limit: Memo<Option<Limit>>,
    loaded: RwSignal<Option<Loaded>>,
    outcome: RwSignal<Outcome>,
    ranking: Signal<Option<Measure>>,
) -> impl IntoView {
    let narrow = use_context::<NarrowScreen>().map(|n| n.0);
    move || {
        let w = drawing_width(narrow);
        let plot_w = w - LEFT - RIGHT;
        let by = ranking.get()?;
        let l = loaded.get()?;
        let unit = case_unit.get().symbol();
        let limit = limit.get()?;
        outcome.with(|o| {
            let Some(Ok(o)) = o else { return None };
            let time = l.kinds.iter().position(|k| *k == ColumnKind::Time);
            let xs: Vec<f64> = match time {
                Some(c) => o.rows.iter().map(|&i| l.table.row(i)[c]).collect(),
                None => o.rows.iter().map(|&i| f64::from(l.table.lines[i])).collect(),
            };
            let t = trace(&xs, &values_of(&o.measures, by), plot_w as usize);
            let allow = limit.0.map(|(a, _)| a);
            let ys = y_span(t.range, allow);
            let py = |y: f64| TOP + (ys.1 - y) / (ys.1 - ys.0) * PLOT_H;
            // Each pixel column a vertical stroke from its least to its greatest value, joined
            // to the next: a million rows make at most one point pair per pixel.
            let mut d = String::new();
            let mut pen_up = true;
            for (j, c) in t.columns.iter().enumerate() {
                let Some((a, b)) = c else {
                    pen_up = true;
                    continue;
                };
                let x = LEFT + j as f64 + 0.5;
                let _ = write!(d, "{}{x:.1},{:.1}L{x:.1},{:.1}", if pen_up { "M" } else { "L" }, py(*a), py(*b));
                pen_up = false;
            }
            let x_name = match time {
                Some(c) => format!("{} (as in the file)", l.names()[c]),
                None => "line in the file".to_string(),
            };
            let drawn = t.columns.iter().filter(|c| c.is_some()).count();
            let (lo, hi) = t.range.unwrap_or((f64::NAN, f64::NAN));
            let caption = format!(
                "{} of {} rows, least and greatest in each of {drawn} pixel columns. {}",
                measure_symbol(by),
                o.rows.len(),
                allowable_sentence(limit, by, unit)
            );
            let not_drawn = (t.not_drawn > 0).then(|| format!(
                " {} rows have no finite value and are not drawn (n = ∞ for an unloaded row; undefined where the criterion does not apply).",
                t.not_drawn
            ));
            Some(view! {
                <figure class="scan-plot table-picture">
                    <svg id="table-trace" viewBox=format!("0 0 {w} {H}") role="img"
                        aria-label=format!("{} against {x_name}", measure_symbol(by))
                        data-x=if time.is_some() { "time" } else { "line" }
                        data-min=lo.to_string() data-max=hi.to_string()
                        data-allowable=allow.map(|a| a.to_string()).unwrap_or_default()
                        data-columns=drawn.to_string()>
                        {axes(w, t.x, ys, &x_name, &y_name(by, unit))}
                        <path class="curve vm" d=d></path>
                        {allow.map(|a| view! {
                            <line class="allowable" x1=LEFT x2=LEFT + plot_w y1=py(a) y2=py(a)></line>
                            <text class="allowable-label" x=LEFT + plot_w - 4.0 y=py(a) - 5.0 text-anchor="end">{allowable_text(a, by, unit)}</text>
                        })}
                    </svg>
                    <figcaption>{caption}{not_drawn}</figcaption>
                </figure>
            })
        })
    }
}

/// How many rows have each value of the measure (`table-histogram`).
#[component]
pub fn MeasureHistogram(
    case_unit: Memo<StressUnit>,
    limit: Memo<Option<Limit>>,
    outcome: RwSignal<Outcome>,
    ranking: Signal<Option<Measure>>,
) -> impl IntoView {
    let narrow = use_context::<NarrowScreen>().map(|n| n.0);
    move || {
        let w = drawing_width(narrow);
        let plot_w = w - LEFT - RIGHT;
        let by = ranking.get()?;
        let unit = case_unit.get().symbol();
        let limit = limit.get()?;
        outcome.with(|o| {
            let Some(Ok(o)) = o else { return None };
            let values = values_of(&o.measures, by);
            // A factor of safety runs to 10⁶ at lightly loaded rows: bins stop at 5× the
            // required one and the rest is counted beside them.
            let cap = (by == Measure::Factor)
                .then(|| limit.0.map(|(a, _)| 5.0 * a))
                .flatten();
            let mut h = histogram(&values, BINS, cap);
            if h.counts.iter().all(|&c| c == 0) && h.above > 0 {
                h = histogram(&values, BINS, None);
            }
            let allow = limit.0.map(|(a, _)| a);
            let mut xs = h.span;
            if let Some(a) = allow {
                xs = (xs.0.min(a), xs.1.max(a));
            }
            let pad = 0.02 * (xs.1 - xs.0).max(f64::MIN_POSITIVE);
            let xs = (xs.0 - pad, xs.1 + pad);
            let most = h.counts.iter().copied().max().unwrap_or(0).max(1) as f64;
            let ys = (0.0, most * 1.05);
            let px = |x: f64| LEFT + (x - xs.0) / (xs.1 - xs.0) * plot_w;
            let py = |y: f64| TOP + (ys.1 - y) / (ys.1 - ys.0) * PLOT_H;
            let bin_w = (h.span.1 - h.span.0) / BINS as f64;
            let bars = h.counts.iter().enumerate().filter(|(_, &c)| c > 0).map(|(b, &c)| {
                let x0 = px(h.span.0 + b as f64 * bin_w);
                let x1 = px(h.span.0 + (b + 1) as f64 * bin_w);
                view! { <rect class="bar" x=x0 y=py(c as f64) width=(x1 - x0 - 0.5).max(0.5) height=py(0.0) - py(c as f64)></rect> }
            }).collect_view();
            let counted: usize = h.counts.iter().sum();
            let mut caption = format!("Rows in each of {BINS} equal bins of {}.", measure_symbol(by));
            if h.above > 0 {
                let _ = write!(caption, " {} rows above {} are counted beside the bins.", h.above, format_sig(h.span.1, 3));
            }
            if h.not_finite > 0 {
                let _ = write!(caption, " {} rows have no finite value (n = ∞ for an unloaded row).", h.not_finite);
            }
            let _ = write!(caption, " {}", allowable_sentence(limit, by, unit));
            Some(view! {
                <figure class="scan-plot table-picture">
                    <svg id="table-histogram" viewBox=format!("0 0 {w} {H}") role="img"
                        aria-label=format!("histogram of {}", measure_symbol(by))
                        data-count=counted.to_string() data-above=h.above.to_string()
                        data-not-finite=h.not_finite.to_string()
                        data-allowable=allow.map(|a| a.to_string()).unwrap_or_default()>
                        {axes(w, xs, ys, &y_name(by, unit), "rows")}
                        {bars}
                        {allow.map(|a| view! {
                            <line class="allowable" x1=px(a) x2=px(a) y1=TOP y2=TOP + PLOT_H></line>
                            // Beside the line, on the side with room for the words.
                            {if px(a) > LEFT + 0.6 * plot_w {
                                view! { <text class="allowable-label" x=px(a) - 4.0 y=TOP + 14.0 text-anchor="end">{allowable_text(a, by, unit)}</text> }
                            } else {
                                view! { <text class="allowable-label" x=px(a) + 4.0 y=TOP + 14.0 text-anchor="start">{allowable_text(a, by, unit)}</text> }
                            }}
                        })}
                    </svg>
                    <figcaption>{caption}</figcaption>
                </figure>
            })
        })
    }
}
