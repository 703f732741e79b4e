//! "Around the section": von Mises and σ1 against position around the perimeter (and on the bore
//! of a tube), the critical points marked, the chosen point shown, and one click to move the
//! point to a critical one.
//!
//! [`picture`] turns core's scan into plain drawing data (tested natively); [`ScanPlot`] draws
//! it. The `<svg>` carries the highest values as `data-max-vm` and `data-max-s1` (case unit).

use crate::formats::link::Case;
use crate::model::case::{CaseForm, Field};
use crate::model::choices::{SectionKind, Source};
use crate::model::evaluation::Evaluation;
use crate::model::inputs::Num;
use crate::model::judge::Governing;
use crate::model::numfmt::{format_for_entry, format_sig};
use crate::model::source::{self, Outcome};
use crate::panels::export_buttons::ExportButtons;
use crate::panels::plot::{nice_ticks, push_point};
use crate::panels::results::location_text;
use crate::panels::shared_case::SharedCase;
use crate::panels::stale_notice::StaleBadge;
use leptos::prelude::*;
use stresscase_core::section::{Critical, Location, Path, Scan, Section};
use stresscase_core::AngleUnit;

const W: f64 = 560.0;
const H: f64 = 250.0;
const LEFT: f64 = 62.0;
const RIGHT: f64 = 14.0;
const TOP: f64 = 16.0;
const BOTTOM: f64 = 40.0;

/// One polyline.
#[derive(Debug, Clone, PartialEq)]
pub struct Line {
    /// CSS class (`vm outer`, `s1 bore`, …).
    pub class: &'static str,
    /// SVG `points`.
    pub points: String,
}

/// A marked point.
#[derive(Debug, Clone, PartialEq)]
pub struct Marker {
    /// `max-vm` or `max-s1`.
    pub role: &'static str,
    /// Pixel x.
    pub x: f64,
    /// Pixel y.
    pub y: f64,
    /// Label.
    pub label: String,
    /// Pixel position of the label's baseline start (kept clear of the other marker's label).
    pub label_at: (f64, f64),
}

/// Room a marker label takes: its width (px, at the plot's 11 px text) and line height.
const LABEL_W: f64 = 150.0;
const LABEL_H: f64 = 14.0;

/// Moves the lower of two marker labels whose boxes would overlap one line further down, so
/// two maxima at (nearly) the same place keep both labels readable.
fn separate_labels(markers: &mut [Marker]) {
    if let [a, b] = markers {
        let (upper, lower) = if a.label_at.1 <= b.label_at.1 {
            (a, b)
        } else {
            (b, a)
        };
        let overlap_x = (upper.label_at.0 - lower.label_at.0).abs() < LABEL_W;
        if overlap_x && lower.label_at.1 - upper.label_at.1 < LABEL_H {
            lower.label_at.1 = upper.label_at.1 + LABEL_H;
        }
    }
}

/// The plot as data.
#[derive(Debug, Clone, PartialEq)]
pub struct Picture {
    /// Curves.
    pub lines: Vec<Line>,
    /// Critical points.
    pub markers: Vec<Marker>,
    /// Pixel x of the chosen point, if it is on a plotted path.
    pub chosen: Option<f64>,
    /// (pixel y, label) of stress ticks.
    pub y_ticks: Vec<(f64, String)>,
    /// (pixel x, label) of position ticks.
    pub x_ticks: Vec<(f64, String)>,
    /// Pixel x of face boundaries (rectangle) with the face name to their right.
    pub faces: Vec<(f64, &'static str)>,
    /// x-axis title.
    pub x_title: String,
    /// y-axis title.
    pub y_title: String,
    /// The position at the right end of the axis (2π, or the perimeter).
    pub x_max: f64,
}

/// Builds the plot. Stresses are in the case's unit `unit`; round positions are radians shown in
/// `au`, rectangle positions are lengths in `length` (its symbol). `perimeter` is the rectangle's
/// perimeter length (0 for a round section); `chosen` the chosen point's position.
#[must_use]
pub fn picture(
    scan: &Scan,
    unit: &str,
    au: AngleUnit,
    length: &str,
    perimeter: f64,
    chosen: Option<f64>,
) -> Picture {
    let round = perimeter == 0.0;
    let x_max = if round {
        2.0 * core::f64::consts::PI
    } else {
        perimeter
    };
    let mut lo = 0.0_f64;
    let mut hi = 0.0_f64;
    for c in &scan.curves {
        for s in &c.samples {
            lo = lo.min(s.sigma1).min(s.von_mises);
            hi = hi.max(s.sigma1).max(s.von_mises);
        }
    }
    if hi - lo <= f64::MIN_POSITIVE || !(hi - lo).is_finite() {
        hi = lo + 1.0;
    }
    let pad = 0.06 * (hi - lo);
    let (lo, hi) = (lo - pad, hi + pad);
    let px = |x: f64| LEFT + (W - LEFT - RIGHT) * (x / x_max);
    let py = |v: f64| TOP + (H - TOP - BOTTOM) * (hi - v) / (hi - lo);
    let mut lines = Vec::new();
    for c in &scan.curves {
        let pts = |pick: fn(&stresscase_core::section::Sample) -> f64| {
            let mut out = String::with_capacity(16 * (c.samples.len() + 1));
            for s in &c.samples {
                push_point(&mut out, px(s.position), py(pick(s)));
            }
            out
        };
        let (vm, s1) = match c.path {
            Path::Bore => ("vm bore", "s1 bore"),
            _ => ("vm outer", "s1 outer"),
        };
        // Close a round curve at 360°.
        let mut vm_pts = pts(|s| s.von_mises);
        let mut s1_pts = pts(|s| s.sigma1);
        if round {
            if let Some(first) = c.samples.first() {
                push_point(&mut vm_pts, px(x_max), py(first.von_mises));
                push_point(&mut s1_pts, px(x_max), py(first.sigma1));
            }
        }
        lines.push(Line {
            class: vm,
            points: vm_pts,
        });
        lines.push(Line {
            class: s1,
            points: s1_pts,
        });
    }
    let mark = |role: &'static str, name: &str, c: &Critical| {
        let (x, y) = (px(c.position), py(c.value));
        Marker {
            role,
            x,
            y,
            label: format!("{name} {} {unit}", format_sig(c.value, 4)),
            label_at: ((x + 7.0).min(W - LABEL_W), (y - 7.0).max(12.0)),
        }
    };
    let mut markers = vec![
        mark("max-vm", "max σvm", &scan.max_von_mises),
        mark("max-s1", "max σ1", &scan.max_principal),
    ];
    separate_labels(&mut markers);
    let y_ticks = nice_ticks(lo, hi, 6)
        .into_iter()
        .map(|v| (py(v), format_sig(v, 3)))
        .collect();
    let (x_ticks, x_title) = if round {
        let ticks = (0..=8)
            .map(|i| {
                let x = f64::from(i) * x_max / 8.0;
                let label = match au {
                    AngleUnit::Degree => format!("{}°", i * 45),
                    AngleUnit::Radian => format_sig(x, 3),
                };
                (px(x), label)
            })
            .collect();
        let t = match au {
            AngleUnit::Degree => "perimeter angle φ (°), from +y towards +z",
            AngleUnit::Radian => "perimeter angle φ (rad), from +y towards +z",
        };
        (ticks, t.to_string())
    } else {
        let ticks = nice_ticks(0.0, x_max, 8)
            .into_iter()
            .map(|v| (px(v), format_sig(v, 3)))
            .collect();
        (
            ticks,
            format!("position s along the perimeter ({length}), from the corner (h/2, −b/2)"),
        )
    };
    Picture {
        lines,
        markers,
        chosen: chosen.map(px),
        y_ticks,
        x_ticks,
        faces: Vec::new(),
        x_title,
        y_title: format!("stress ({unit})"),
        x_max,
    }
}

/// The rectangle of the case in its length unit, if the section is one.
fn rectangle_of(case: &Case) -> Option<stresscase_core::section::Rectangle> {
    let mut c = case.choices;
    // Positions on the plot are in the length unit: build the section in that unit.
    c.length = stresscase_core::units::LengthUnit::M;
    match source::section(&c, case).ok()? {
        Section::Rectangle(r) => Some(r),
        Section::Round(_) => None,
    }
}

/// Moves the chosen point to a critical one.
fn use_point(form: &mut CaseForm, at: Location) {
    match at {
        Location::Round { phi, r } => {
            let deg = form.angle_unit.from_radians(phi);
            let step = if form.angle_unit == AngleUnit::Degree {
                1e4
            } else {
                1e6
            };
            form.set_text(
                Field::Src(Num::Phi),
                format_for_entry((deg * step).round() / step),
            );
            if form.choices.kind == SectionKind::Tube {
                form.set_text(Field::Src(Num::R), format_for_entry(r));
            }
        }
        Location::Rectangle { face, along } => {
            form.choices.face = face;
            // Seven significant digits are plenty for a position and hide search noise.
            let along = if along == 0.0 {
                0.0
            } else {
                let step = 10f64.powi(along.abs().log10().floor() as i32 - 6);
                (along / step).round() * step
            };
            form.set_text(Field::Src(Num::Along), format_for_entry(along));
        }
    }
}

/// The plot panel (only for sections with a scan).
#[component]
pub fn ScanPlot(
    form: RwSignal<CaseForm>,
    shown: Memo<Option<Evaluation>>,
    stale: Memo<bool>,
) -> impl IntoView {
    let shared = SharedCase::of(form);
    let scan = Memo::new(move |_| {
        shown.with(|e| {
            e.as_ref().and_then(|e| match &e.outcome {
                Some(Outcome::Section(s)) if e.choices.source == Source::Section => s
                    .scan
                    .clone()
                    .map(|scan| (scan, e.unit, e.angle_unit, e.choices.length)),
                _ => None,
            })
        })
    });
    let governing = Memo::new(move |_| {
        shown.with(|e| {
            e.as_ref().and_then(|e| {
                let g = e.governing.clone()?;
                let fatigue = e.judgement.fatigue.as_ref().map(|f| f.in_use.name());
                Some((
                    g,
                    e.judgement.in_use.name(),
                    fatigue,
                    e.choices.length,
                    e.angle_unit,
                ))
            })
        })
    });
    let pic = Memo::new(move |_| {
        scan.with(|s| {
            s.as_ref().map(|(scan, unit, au, lu)| {
                let (rect, chosen) = shared.case.with(|c| {
                    let Some(case) = c.as_ref() else {
                        return (None, None);
                    };
                    use crate::model::source::Numbers;
                    let rect = rectangle_of(case);
                    let chosen = match rect {
                        Some(r) => r.position_of(case.choices.face, case.get(Num::Along)),
                        None => case
                            .angle_unit
                            .to_radians(case.get(Num::Phi))
                            .rem_euclid(2.0 * core::f64::consts::PI),
                    };
                    (rect, Some(chosen))
                });
                let perimeter = rect.map_or(0.0, |r| r.perimeter());
                let mut p = picture(scan, unit.symbol(), *au, lu.symbol(), perimeter, chosen);
                if let Some(r) = rect {
                    let (b, h) = (r.width(), r.depth());
                    let x = |s: f64| LEFT + (W - LEFT - RIGHT) * s / perimeter;
                    p.faces = vec![
                        (x(0.0), "face +y"),
                        (x(b), "face +z"),
                        (x(b + h), "face −y"),
                        (x(2.0 * b + h), "face −z"),
                    ];
                }
                (p, scan.max_von_mises.value, scan.max_principal.value)
            })
        })
    });
    let go = move |pick: fn(&Scan) -> Location| {
        if let Some((scan, ..)) = scan.get_untracked() {
            form.update(|f| use_point(f, pick(&scan)));
        }
    };
    let go_governing = move |pick: fn(&Governing) -> Option<Location>| {
        if let Some(at) = governing.with_untracked(|g| g.as_ref().and_then(|(g, ..)| pick(g))) {
            form.update(|f| use_point(f, at));
        }
    };
    // Positions on the plot's axis of the governing points (static, fatigue).
    let governing_x = move || {
        governing.with(|g| {
            g.as_ref()
                .map(|(g, ..)| {
                    (
                        g.static_point.as_ref().map(|(c, _)| c.position),
                        g.fatigue_point.as_ref().map(|(c, _)| c.position),
                    )
                })
                .unwrap_or_default()
        })
    };
    let governing_text = move || {
        governing.with(|g| {
            g.as_ref().map(|(g, crit, fcrit, lu, au)| {
                let n = |n: &Option<f64>| {
                    n.map_or_else(|| "∞ (unloaded)".to_string(), |n| format_sig(n, 3))
                };
                let mut parts = Vec::new();
                if let Some((c, f)) = &g.static_point {
                    parts.push(format!(
                        "Lowest static factor, {crit}: n = {} at {}.",
                        n(f),
                        location_text(c.at, *lu, *au)
                    ));
                }
                if let (Some((c, f)), Some(fc)) = (&g.fatigue_point, fcrit) {
                    parts.push(format!(
                        "Lowest fatigue factor, {fc}: n = {} at {}.",
                        n(f),
                        location_text(c.at, *lu, *au)
                    ));
                }
                if let Some(note) = g.fatigue_note {
                    parts.push(note.to_string());
                }
                parts.push("Equal factors go to the point with the tensile mean stress.".into());
                parts.join(" ")
            })
        })
    };
    let both = move || {
        governing.with(|g| {
            g.as_ref()
                .is_some_and(|(g, ..)| match (&g.static_point, &g.fatigue_point) {
                    (Some((a, _)), Some((b, _))) => a.at != b.at,
                    _ => false,
                })
        })
    };
    move || {
        pic.get().map(|(p, max_vm, max_s1)| {
            let lines = p.lines.iter().map(|l| view! { <polyline class=format!("curve {}", l.class) points=l.points.clone()/> }).collect_view();
            let markers = p.markers.iter().map(|m| view! {
                <g class=format!("marker {}", m.role) data-role=m.role>
                    <circle cx=format!("{:.2}", m.x) cy=format!("{:.2}", m.y) r="5"/>
                    <text x=format!("{:.2}", m.label_at.0) y=format!("{:.2}", m.label_at.1)>{m.label.clone()}</text>
                </g>
            }).collect_view();
            let yt = p.y_ticks.iter().map(|(y, t)| view! {
                <g class="tick"><line x1=LEFT x2=W - RIGHT y1=*y y2=*y class="grid"/><text x=LEFT - 6.0 y=y + 4.0 text-anchor="end">{t.clone()}</text></g>
            }).collect_view();
            let xt = p.x_ticks.iter().map(|(x, t)| view! {
                <g class="tick"><text x=*x y=H - BOTTOM + 15.0 text-anchor="middle">{t.clone()}</text></g>
            }).collect_view();
            let faces = p.faces.iter().map(|(x, name)| view! {
                <g class="face-mark"><line x1=*x x2=*x y1=TOP y2=H - BOTTOM/><text x=x + 3.0 y=TOP + 10.0>{*name}</text></g>
            }).collect_view();
            let chosen = p.chosen.map(|x| view! { <line class="chosen" id="scan-chosen" x1=x x2=x y1=TOP y2=H - BOTTOM/> });
            let to_px = |pos: f64| LEFT + (W - LEFT - RIGHT) * pos / p.x_max;
            let (gs, gf) = governing_x();
            // One line per distinct point, labelled just above the axis (clear of the maxima).
            let same = matches!((gs, gf), (Some(a), Some(b)) if (a - b).abs() < 1e-9 * p.x_max);
            let marks: Vec<(f64, &str, &str)> = if same {
                gs.map(|x| (x, "gov-static", "lowest n: static and fatigue")).into_iter().collect()
            } else {
                [(gs, "gov-static", "lowest n, static"), (gf, "gov-fatigue", "lowest n, fatigue")]
                    .into_iter()
                    .filter_map(|(pos, id, label)| pos.map(|pos| (pos, id, label)))
                    .collect()
            };
            let gov = marks
                .into_iter()
                .enumerate()
                .map(|(i, (pos, id, label))| {
                    let x = to_px(pos);
                    let right = x < W - 140.0;
                    view! {
                        <g class=format!("governing {id}") id=format!("scan-{id}")>
                            <line x1=x x2=x y1=TOP y2=H - BOTTOM/>
                            <text x=if right { x + 4.0 } else { x - 4.0 } y=H - BOTTOM - 6.0 - 14.0 * i as f64
                                text-anchor=if right { "start" } else { "end" }>{label}</text>
                        </g>
                    }
                })
                .collect_view();
            view! {
                <figure class="panel scan-plot" id="panel-scan">
                    <h2>"Around the section"<StaleBadge stale=stale/></h2>
                    <svg id="scan-svg" viewBox=format!("0 0 {W} {H}") role="img"
                        aria-label="von Mises and largest principal stress around the section"
                        data-max-vm=format!("{max_vm:e}") data-max-s1=format!("{max_s1:e}")>
                        <rect class="plot-bg" x=LEFT y=TOP width=W - LEFT - RIGHT height=H - TOP - BOTTOM/>
                        {yt}{xt}{faces}{lines}{chosen}{gov}{markers}
                        <text class="axis-label" x=(LEFT + W - RIGHT) / 2.0 y=H - 6.0 text-anchor="middle">{p.x_title.clone()}</text>
                        <text class="axis-label" x="14" y=(TOP + H - BOTTOM) / 2.0 transform=format!("rotate(-90 14 {})", (TOP + H - BOTTOM) / 2.0) text-anchor="middle">{p.y_title.clone()}</text>
                    </svg>
                    <figcaption>
                        <span class="key vm">"— von Mises"</span>" "
                        <span class="key s1">"- - largest principal σ1"</span>" "
                        <span class="key bore">"(lighter: the bore)"</span>" "
                        <span class="key chosen">"| the chosen point"</span>" "
                        <span class="key governing">"¦ lowest factor of safety"</span>
                    </figcaption>
                    <p class="governing-note" id="governing-note" class:stale=move || stale.get()>{governing_text}</p>
                    <div class="buttons">
                        <button type="button" id="to-governing" on:click=move |_| go_governing(|g| g.decision().map(|c| c.at))>"Move the point to where the factor of safety is lowest"</button>
                        <button type="button" id="to-governing-static" hidden=move || !both() on:click=move |_| go_governing(|g| g.static_point.as_ref().map(|(c, _)| c.at))>"… lowest static factor"</button>
                        <button type="button" id="to-governing-fatigue" hidden=move || !both() on:click=move |_| go_governing(|g| g.fatigue_point.as_ref().map(|(c, _)| c.at))>"… lowest fatigue factor"</button>
                        <button type="button" id="use-max-vm" on:click=move |_| go(|s| s.max_von_mises.at)>"Move the point to the highest von Mises"</button>
                        <button type="button" id="use-max-s1" on:click=move |_| go(|s| s.max_principal.at)>"Move the point to the highest σ1"</button>
                    </div>
                    <ExportButtons svg_id="scan-svg" name="scan"/>
                </figure>
            }
        })
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::model::choices::Choices;
    use stresscase_core::section::Face;

    #[test]
    fn markers_sit_at_the_scan_maxima() {
        let mut f = CaseForm::demo();
        f.choices = Choices {
            source: Source::Section,
            ..Choices::default()
        };
        let e = f.evaluate().unwrap();
        let Some(Outcome::Section(s)) = &e.outcome else {
            panic!()
        };
        let scan = s.scan.as_ref().unwrap();
        let p = picture(scan, "MPa", AngleUnit::Degree, "mm", 0.0, Some(0.0));
        // Every curve point lies inside the plot frame, and the von Mises marker is the
        // highest point of the von Mises curve (smallest pixel y).
        let vm_marker = p.markers.iter().find(|m| m.role == "max-vm").unwrap();
        for l in &p.lines {
            for pt in l.points.split(' ') {
                let (x, y) = pt.split_once(',').unwrap();
                let (x, y): (f64, f64) = (x.parse().unwrap(), y.parse().unwrap());
                assert!((LEFT - 0.01..=W - RIGHT + 0.01).contains(&x), "{x}");
                assert!((TOP - 0.01..=H - BOTTOM + 0.01).contains(&y), "{y}");
                if l.class.starts_with("vm") {
                    assert!(y >= vm_marker.y - 0.02, "{y} above the max {}", vm_marker.y);
                }
            }
        }
        assert!(vm_marker.label.ends_with("MPa"));
        // Two maxima at the same place: the labels sit on separate lines.
        let (a, b) = (p.markers[0].label_at, p.markers[1].label_at);
        assert!(
            (a.0 - b.0).abs() >= LABEL_W || (a.1 - b.1).abs() >= LABEL_H,
            "{a:?} {b:?}"
        );
        assert_eq!(p.chosen, Some(LEFT));
    }

    #[test]
    fn using_a_critical_point_sets_the_point_fields() {
        let mut f = CaseForm::demo();
        f.choices.source = Source::Section;
        f.choices.kind = SectionKind::Rectangle;
        use_point(
            &mut f,
            Location::Rectangle {
                face: Face::NegZ,
                along: 7.5,
            },
        );
        assert_eq!(f.choices.face, Face::NegZ);
        assert_eq!(f.text(Field::Src(Num::Along)), "7.5");
        use_point(
            &mut f,
            Location::Rectangle {
                face: Face::PosY,
                along: 12.345678912345,
            },
        );
        assert_eq!(f.text(Field::Src(Num::Along)), "12.34568");
        f.choices.kind = SectionKind::Tube;
        use_point(
            &mut f,
            Location::Round {
                phi: core::f64::consts::PI,
                r: 14.0,
            },
        );
        assert_eq!(f.text(Field::Src(Num::Phi)), "180");
        assert_eq!(f.text(Field::Src(Num::R)), "14");
    }
}
