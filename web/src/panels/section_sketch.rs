//! The section as seen from its +x end (x towards the viewer, so y up and z to the left), with
//! the chosen point and the critical points of the scan marked: where φ and the faces are.

use crate::model::case::CaseForm;
use crate::model::choices::Source;
use crate::model::evaluation::Evaluation;
use crate::model::source::{self, Outcome};
use crate::model::{choices, inputs};
use crate::panels::shared_case::SharedCase;
use leptos::prelude::*;
use stresscase_core::section::{Face, Location, Section};
use stresscase_core::units::LengthUnit;

const SIZE: f64 = 180.0;
const C: f64 = 90.0;
const R: f64 = 62.0;

/// A marked point (pixels).
#[derive(Debug, Clone, PartialEq)]
pub struct Mark {
    /// `chosen`, `max-vm` or `max-s1`.
    pub role: &'static str,
    /// Pixel x.
    pub x: f64,
    /// Pixel y.
    pub y: f64,
}

/// The outline: a circle (r outer, r inner) or a rectangle (x, y, w, h), in pixels.
#[derive(Debug, Clone, PartialEq)]
pub enum Outline {
    /// Round section: outer and inner radius in pixels.
    Round(f64, f64),
    /// Rectangle: left, top, width, height in pixels.
    Rect(f64, f64, f64, f64),
}

/// The sketch as data.
#[derive(Debug, Clone, PartialEq)]
pub struct Picture {
    /// The outline.
    pub outline: Outline,
    /// Points.
    pub marks: Vec<Mark>,
}

/// (y, z) of a location (lengths in the section's unit).
fn yz(at: Location, s: &Section) -> (f64, f64) {
    match (at, s) {
        (Location::Round { phi, r }, _) => (r * phi.cos(), r * phi.sin()),
        (Location::Rectangle { face, along }, Section::Rectangle(rc)) => match face {
            Face::PosY => (0.5 * rc.depth(), along),
            Face::NegY => (-0.5 * rc.depth(), along),
            Face::PosZ => (along, 0.5 * rc.width()),
            Face::NegZ => (along, -0.5 * rc.width()),
        },
        _ => (0.0, 0.0),
    }
}

/// Builds the sketch for a section (in any one length unit) and locations in that unit.
#[must_use]
pub fn picture(s: &Section, points: &[(&'static str, Location)]) -> Picture {
    let (outline, k) = match s {
        Section::Round(r) => {
            let k = R / r.outer_radius();
            (Outline::Round(R, r.inner_radius() * k), k)
        }
        Section::Rectangle(rc) => {
            let k = 2.0 * R / rc.depth().max(rc.width());
            let (w, h) = (rc.width() * k, rc.depth() * k);
            (Outline::Rect(C - w / 2.0, C - h / 2.0, w, h), k)
        }
    };
    // Seen from +x: y up, z to the left.
    let marks = points
        .iter()
        .map(|&(role, at)| {
            let (y, z) = yz(at, s);
            Mark {
                role,
                x: C - z * k,
                y: C - y * k,
            }
        })
        .collect();
    Picture { outline, marks }
}

/// The sketch, drawn inside the section panel.
#[component]
pub fn SectionSketch(form: RwSignal<CaseForm>, shown: Memo<Option<Evaluation>>) -> impl IntoView {
    let shared = SharedCase::of(form);
    let pic = Memo::new(move |_| {
        let case = shared.case.get()?;
        if case.choices.source != Source::Section {
            return None;
        }
        // Lengths stay in the entry unit: build the section as if it were metres.
        let mut c = case.choices;
        c.length = LengthUnit::M;
        let s = source::section(&c, &case).ok()?;
        let chosen = match (s, c.kind) {
            (Section::Rectangle(_), _) => Location::Rectangle {
                face: c.face,
                along: source::Numbers::get(&case, inputs::Num::Along),
            },
            // A typed radius stays drawable while it is being edited.
            (Section::Round(r), choices::SectionKind::Tube) => Location::Round {
                phi: case
                    .angle_unit
                    .to_radians(source::Numbers::get(&case, inputs::Num::Phi)),
                r: source::Numbers::get(&case, inputs::Num::R)
                    .clamp(r.inner_radius(), r.outer_radius()),
            },
            (Section::Round(r), _) => Location::Round {
                phi: case
                    .angle_unit
                    .to_radians(source::Numbers::get(&case, inputs::Num::Phi)),
                r: r.outer_radius(),
            },
        };
        let mut points = vec![("chosen", chosen)];
        shown.with(|e| {
            if let Some(Outcome::Section(o)) = e.as_ref().and_then(|e| e.outcome.as_ref()) {
                if let Some(scan) = &o.scan {
                    points.push(("max-vm", scan.max_von_mises.at));
                    points.push(("max-s1", scan.max_principal.at));
                }
            }
        });
        Some(picture(&s, &points))
    });
    move || {
        pic.get().map(|p| {
            let outline = match p.outline {
                Outline::Round(ro, ri) => view! {
                    <g class="outline">
                        <circle cx=C cy=C r=ro/>
                        {(ri > 0.0).then(|| view! { <circle class="bore" cx=C cy=C r=ri/> })}
                    </g>
                }
                .into_any(),
                Outline::Rect(x, y, w, h) => view! {
                    <g class="outline"><rect x=x y=y width=w height=h/></g>
                }
                .into_any(),
            };
            let marks = p
                .marks
                .iter()
                .rev()
                .map(|m| view! { <circle class=format!("mark {}", m.role) data-role=m.role cx=m.x cy=m.y r=if m.role == "chosen" { 5.5 } else { 7.5 }/> })
                .collect_view();
            view! {
                <figure class="section-sketch">
                    <svg id="section-svg" viewBox=format!("0 0 {SIZE} {SIZE}") role="img" aria-label="the section seen from its +x end">
                        {outline}
                        <line class="axis" x1=C y1=C x2=C y2="8"/>
                        <text x=C + 4.0 y="14">"y"</text>
                        <line class="axis" x1=C y1=C x2="8" y2=C/>
                        <text x="8" y=C - 5.0>"z"</text>
                        <circle class="x-dot" cx=C cy=C r="2.5"/>
                        {marks}
                    </svg>
                    <figcaption>"Seen from the +x end (x towards you): y up, z to the left; φ turns from +y towards +z. Amber: the chosen point; red ring: highest von Mises; violet ring: highest σ1."</figcaption>
                </figure>
            }
        })
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use stresscase_core::section::{Rectangle, Round};

    #[test]
    fn phi_zero_is_up_and_ninety_degrees_is_left() {
        let s = Section::Round(Round::solid(40.0).unwrap());
        let p = picture(
            &s,
            &[
                ("chosen", Location::Round { phi: 0.0, r: 20.0 }),
                (
                    "max-vm",
                    Location::Round {
                        phi: core::f64::consts::FRAC_PI_2,
                        r: 20.0,
                    },
                ),
            ],
        );
        assert!((p.marks[0].x - C).abs() < 1e-9 && (p.marks[0].y - (C - R)).abs() < 1e-9);
        assert!((p.marks[1].x - (C - R)).abs() < 1e-9 && (p.marks[1].y - C).abs() < 1e-9);
    }

    #[test]
    fn a_rectangle_point_sits_on_its_face() {
        let s = Section::Rectangle(Rectangle::new(20.0, 50.0).unwrap());
        let p = picture(
            &s,
            &[(
                "chosen",
                Location::Rectangle {
                    face: Face::PosZ,
                    along: 0.0,
                },
            )],
        );
        let Outline::Rect(x, _, w, _) = p.outline else {
            panic!()
        };
        // +z is to the left: the +z face is the rectangle's left edge.
        assert!(
            (p.marks[0].x - x).abs() < 1e-9,
            "{} vs {x} (w {w})",
            p.marks[0].x
        );
    }
}
