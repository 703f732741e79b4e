//! "Mohr diagram": the three circles (plane mode: the in-plane circle highlighted, the two
//! out-of-plane circles dashed), face points, principal and maximum-shear points, point N of the
//! probed plane, and axes with ticks in the case's unit.
//!
//! The picture is computed as plain data by [`picture`] (tested natively) and drawn by
//! [`MohrDiagram`]. Circles are drawn in pixels; the `<svg>` carries the map from stresses to pixels
//! as `data-origin-x`, `data-origin-y` and `data-px-per-unit` so tests can check every circle
//! against core.

use crate::model::case::{CaseForm, Mode};
use crate::model::evaluation::Evaluation;
use crate::model::numfmt::format_sig;
use crate::panels::export_buttons::ExportButtons;
use crate::panels::plot::{nice_ticks, Frame, Viewport};
use crate::panels::stale_notice::StaleBadge;
use leptos::prelude::*;
use stresscase_core::{MohrCircle, ShearAxis};

/// Drawing width in SVG pixels (wide drawing).
pub const WIDTH: f64 = 720.0;
/// Drawing height in SVG pixels (wide drawing).
pub const HEIGHT: f64 = 440.0;
const FRAME: Frame = Frame {
    left: 64.0,
    top: 34.0,
    width: 620.0,
    height: 350.0,
};

/// The drawing's size and plot frame, in SVG pixels.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Size {
    /// viewBox width.
    pub width: f64,
    /// viewBox height.
    pub height: f64,
    /// The plot area.
    pub frame: Frame,
}

/// From a tablet up: shown at about its own size.
pub const WIDE: Size = Size {
    width: WIDTH,
    height: HEIGHT,
    frame: FRAME,
};

/// On a phone: drawn for a narrow screen, so its labels stay at their size instead of shrinking.
pub const NARROW: Size = Size {
    width: 380.0,
    height: 380.0,
    frame: Frame {
        left: 46.0,
        top: 30.0,
        width: 318.0,
        height: 300.0,
    },
};

/// Whether the screen is narrow (a phone), shared by the page.
#[derive(Debug, Clone, Copy)]
pub struct NarrowScreen(pub RwSignal<bool>);

/// A circle as drawn.
#[derive(Debug, Clone, PartialEq)]
pub struct CircleMark {
    /// `c12`, `c23`, `c13` or `inplane`.
    pub role: &'static str,
    /// Pixel centre x.
    pub cx: f64,
    /// Pixel centre y.
    pub cy: f64,
    /// Pixel radius.
    pub r: f64,
    /// Drawn dashed (out-of-plane circles in plane mode).
    pub dashed: bool,
}

/// What a point stands for (sets its colour and shape).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum PointKind {
    /// A face of the element as entered (X, Y).
    Face,
    /// A face of the turned element (X′, Y′).
    Turned,
    /// A principal stress on the σ axis.
    Principal,
    /// A maximum-shear point.
    Shear,
    /// The probed plane N.
    Probe,
}

/// A labelled point as drawn.
#[derive(Debug, Clone, PartialEq)]
pub struct PointMark {
    /// Stable name for tests: `X`, `Y`, `Xt`, `Yt`, `s1`, `s2`, `s3`, `tmax`, `tin`, `N`.
    pub role: &'static str,
    /// Kind.
    pub kind: PointKind,
    /// Pixel x.
    pub x: f64,
    /// Pixel y.
    pub y: f64,
    /// Label text, with value and unit where useful.
    pub label: String,
    /// Label offset in pixels (dx, dy).
    pub offset: (f64, f64),
}

/// A tick on an axis.
#[derive(Debug, Clone, PartialEq)]
pub struct Tick {
    /// Pixel position along the axis.
    pub at: f64,
    /// Label.
    pub text: String,
}

/// The whole diagram as data.
#[derive(Debug, Clone, PartialEq)]
pub struct Picture {
    /// Stress → pixel map.
    pub view: Viewport,
    /// Circles, largest first.
    pub circles: Vec<CircleMark>,
    /// Diameter X′–Y′ of the turned element (plane mode), pixel endpoints.
    pub diameter: Option<[f64; 4]>,
    /// Diameter X–Y.
    pub xy_diameter: Option<[f64; 4]>,
    /// Points.
    pub points: Vec<PointMark>,
    /// σ-axis ticks (x positions).
    pub sigma_ticks: Vec<Tick>,
    /// τ-axis ticks (y positions).
    pub tau_ticks: Vec<Tick>,
    /// Pixel x of the τ axis.
    pub tau_axis_x: f64,
    /// σ-axis label.
    pub sigma_label: String,
    /// τ-axis label, naming the direction of positive τ.
    pub tau_label: String,
    /// One line saying how turning the element moves its point.
    pub rotation_note: &'static str,
    /// Which circle is which, in words.
    pub legend: &'static str,
    /// The drawing's size.
    pub size: Size,
}

fn value(v: f64, unit: &str) -> String {
    format!("{} {unit}", format_sig(v, 4))
}

/// Builds the wide picture for an evaluation.
#[must_use]
pub fn picture(e: &Evaluation) -> Picture {
    picture_sized(e, WIDE)
}

/// Builds the picture for an evaluation at `size`.
#[must_use]
pub fn picture_sized(e: &Evaluation, size: Size) -> Picture {
    let frame = size.frame;
    let unit = e.unit.symbol();
    let axis: ShearAxis = e.shear_axis;
    let m = &e.mohr3d;
    let [s1, s2, s3] = e.principal.values();
    let pm = &e.plane_mohr;
    let plane = e.mode == Mode::Plane;

    let lo = s3.min(0.0).min(e.probe.normal);
    let hi = s1.max(0.0).max(e.probe.normal);
    let (mut lo, mut hi) = (lo, hi);
    if plane {
        for p in [pm.x_face, pm.y_face] {
            lo = lo.min(p.sigma);
            hi = hi.max(p.sigma);
        }
    }
    let r = m.c13.radius.max(pm.circle.radius);
    let pad = 0.08 * (hi - lo).max(2.0 * r).max(f64::MIN_POSITIVE);
    let view = Viewport::fit(lo - pad, hi + pad, -r - pad, r + pad, frame);

    let mark = |role: &'static str, c: &MohrCircle, dashed: bool| CircleMark {
        role,
        cx: view.x(c.centre),
        cy: view.y(0.0),
        r: view.k * c.radius,
        dashed,
    };
    let mut circles = vec![
        mark("c13", &m.c13, plane),
        mark("c12", &m.c12, plane),
        mark("c23", &m.c23, plane),
    ];
    let mut points = Vec::new();
    let mut diameter = None;
    let mut xy_diameter = None;
    let at = |sigma: f64, tau: f64| (view.x(sigma), view.y(axis.height(tau)));

    if plane {
        circles.push(mark("inplane", &pm.circle, false));
        let (xx, xy) = at(pm.x_face.sigma, pm.x_face.tau);
        let (yx, yy) = at(pm.y_face.sigma, pm.y_face.tau);
        xy_diameter = Some([xx, xy, yx, yy]);
        let (tx, ty) = at(pm.x_rotated.sigma, pm.x_rotated.tau);
        let (ux, uy) = at(pm.y_rotated.sigma, pm.y_rotated.tau);
        diameter = Some([tx, ty, ux, uy]);
        points.push(PointMark {
            role: "X",
            kind: PointKind::Face,
            x: xx,
            y: xy,
            label: "X".into(),
            offset: (8.0, -8.0),
        });
        points.push(PointMark {
            role: "Y",
            kind: PointKind::Face,
            x: yx,
            y: yy,
            label: "Y".into(),
            offset: (8.0, -8.0),
        });
        points.push(PointMark {
            role: "Xt",
            kind: PointKind::Turned,
            x: tx,
            y: ty,
            label: "X′".into(),
            offset: (8.0, 14.0),
        });
        points.push(PointMark {
            role: "Yt",
            kind: PointKind::Turned,
            x: ux,
            y: uy,
            label: "Y′".into(),
            offset: (8.0, 14.0),
        });
        let (ix, iy) = at(
            pm.circle.centre,
            if axis == ShearAxis::PositiveDown {
                -pm.circle.radius
            } else {
                pm.circle.radius
            },
        );
        if pm.circle.radius < m.c13.radius * (1.0 - 1e-9) {
            points.push(PointMark {
                role: "tin",
                kind: PointKind::Shear,
                x: ix,
                y: iy,
                label: format!("τ in-plane max = {}", value(pm.circle.radius, unit)),
                offset: (6.0, -8.0),
            });
        }
    } else {
        // In 3D a face plots at (σn, |τn|): its total shear, in-plane and out-of-plane together.
        let marks = [
            ("X", PointKind::Face, "X"),
            ("Y", PointKind::Face, "Y"),
            ("Xt", PointKind::Turned, "X′"),
            ("Yt", PointKind::Turned, "Y′"),
        ];
        for (face, (role, kind, label)) in e.faces_3d.iter().zip(marks) {
            let (x, y) = at(face.normal, face.shear);
            let dy = if kind == PointKind::Face { -8.0 } else { 14.0 };
            points.push(PointMark {
                role,
                kind,
                x,
                y,
                label: label.into(),
                offset: (8.0, dy),
            });
        }
    }

    let labels = [("s1", "σ1", s1), ("s2", "σ2", s2), ("s3", "σ3", s3)];
    for (i, (role, name, v)) in labels.into_iter().enumerate() {
        let (x, y) = at(v, 0.0);
        let dy = if i == 1 { -10.0 } else { 16.0 };
        points.push(PointMark {
            role,
            kind: PointKind::Principal,
            x,
            y,
            label: format!("{name} = {}", value(v, unit)),
            offset: (4.0, dy),
        });
    }
    let (tx, ty) = at(m.c13.centre, m.tau_max());
    points.push(PointMark {
        role: "tmax",
        kind: PointKind::Shear,
        x: tx,
        y: ty,
        label: format!("τmax = {}", value(m.tau_max(), unit)),
        offset: (
            6.0,
            if axis == ShearAxis::PositiveDown {
                16.0
            } else {
                -8.0
            },
        ),
    });
    let (nx, ny) = at(e.probe.normal, e.probe.shear);
    points.push(PointMark {
        role: "N",
        kind: PointKind::Probe,
        x: nx,
        y: ny,
        label: "N".into(),
        offset: (8.0, -6.0),
    });

    let sigma_ticks = nice_ticks(
        view.sigma_at(frame.left),
        view.sigma_at(frame.left + frame.width),
        if size.width < WIDTH { 5 } else { 8 },
    )
    .into_iter()
    .map(|v| Tick {
        at: view.x(v),
        text: format_sig(v, 3),
    })
    .collect();
    let tau_ticks = nice_ticks(
        view.height_at(frame.top + frame.height),
        view.height_at(frame.top),
        6,
    )
    .into_iter()
    .map(|h| Tick {
        at: view.y(h),
        text: format_sig(axis.height(h), 3),
    })
    .collect();
    let tau_axis_x = view.x(0.0).clamp(frame.left, frame.left + frame.width);

    Picture {
        view,
        circles,
        diameter,
        xy_diameter,
        points,
        sigma_ticks,
        tau_ticks,
        tau_axis_x,
        sigma_label: format!("σ ({unit})"),
        tau_label: format!("{} ({unit})", axis.label()),
        rotation_note: axis.rotation_note(),
        legend: if plane {
            "Amber, solid: the x–y circle through X and Y. Dashed: the two out-of-plane circles through σz = 0 — the largest circle, not always the amber one, gives the absolute maximum shear. Point N: the plane by its normal."
        } else {
            "Ink: C13 through σ1 and σ3. Teal: C12. Violet: C23. Every plane's (σn, |τn|) lies inside C13 and outside the two smaller circles; X, Y, X′, Y′ and N are faces and the chosen plane."
        },
        size,
    }
}

fn kind_class(k: PointKind) -> &'static str {
    match k {
        PointKind::Face => "pt face",
        PointKind::Turned => "pt turned",
        PointKind::Principal => "pt principal",
        PointKind::Shear => "pt shear",
        PointKind::Probe => "pt probe",
    }
}

/// The SVG diagram, with the shear-axis convention switch above it.
#[component]
pub fn MohrDiagram(
    form: RwSignal<CaseForm>,
    shown: Memo<Option<Evaluation>>,
    stale: Memo<bool>,
) -> impl IntoView {
    let narrow = use_context::<NarrowScreen>().map(|n| n.0);
    let pic = Memo::new(move |_| {
        let size = if narrow.is_some_and(|n| n.get()) {
            NARROW
        } else {
            WIDE
        };
        shown.with(|s| s.as_ref().map(|e| picture_sized(e, size)))
    });
    let axis_choice = move |a: ShearAxis, id: &'static str, text: &'static str| {
        view! {
            <label>
                <input type="radio" name="shear-axis" id=id
                    prop:checked=move || form.with(|f| f.shear_axis == a)
                    on:change=move |_| form.update(|f| f.shear_axis = a)/>
                {text}
            </label>
        }
    };
    view! {
        <section class="panel diagram" id="panel-mohr">
            <h2>"Mohr diagram"<StaleBadge stale=stale/></h2>
            <div class="axis-switch" role="radiogroup" aria-label="Shear axis direction">
                "Draw positive shear: "
                {axis_choice(ShearAxis::PositiveDown, "axis-down", "downward (turn senses agree)")}
                {axis_choice(ShearAxis::PositiveUp, "axis-up", "upward (graph style)")}
            </div>
            {move || pic.get().map(|p| draw(&p))}
            <ExportButtons svg_id="mohr-svg" name="mohr"/>
        </section>
    }
}

/// A point's label; one that would run past the drawing's right edge is set to its left.
fn label(m: &PointMark, width: f64) -> impl IntoView {
    // About 7 px a character at 12 px.
    let long = m.x + m.offset.0 + 7.0 * m.label.chars().count() as f64 > width;
    let (x, anchor) = if long {
        (m.x - m.offset.0.abs(), "end")
    } else {
        (m.x + m.offset.0, "start")
    };
    view! { <text x=x y=m.y + m.offset.1 text-anchor=anchor>{m.label.clone()}</text> }
}

fn draw(p: &Picture) -> impl IntoView {
    let width = p.size.width;
    let f = p.size.frame;
    let narrow = p.size == NARROW;
    let axis_y = p.view.y(0.0);
    let circles = p
        .circles
        .iter()
        .map(|c| {
            view! {
                <circle class=format!("circle {}", c.role) data-role=c.role cx=c.cx cy=c.cy r=c.r
                    stroke-dasharray=if c.dashed { "6 4" } else { "none" }/>
            }
        })
        .collect_view();
    let line = |d: Option<[f64; 4]>, class: &'static str| {
        d.map(|[x1, y1, x2, y2]| view! { <line class=class x1=x1 y1=y1 x2=x2 y2=y2/> })
    };
    let points = p
        .points
        .iter()
        .map(|m| {
            view! {
                <g class=kind_class(m.kind) data-role=m.role>
                    <circle cx=m.x cy=m.y r="4.5"/>
                    {label(m, width)}
                </g>
            }
        })
        .collect_view();
    let sticks = p
        .sigma_ticks
        .iter()
        .map(|t| {
            view! {
                <g class="tick">
                    <line x1=t.at y1=f.top x2=t.at y2=f.top + f.height class="grid"/>
                    <text x=t.at y=f.top + f.height + 16.0 text-anchor="middle">{t.text.clone()}</text>
                </g>
            }
        })
        .collect_view();
    let tticks = p
        .tau_ticks
        .iter()
        .map(|t| {
            view! {
                <g class="tick">
                    <line x1=f.left y1=t.at x2=f.left + f.width y2=t.at class="grid"/>
                    <text x=f.left - 6.0 y=t.at + 4.0 text-anchor="end">{t.text.clone()}</text>
                </g>
            }
        })
        .collect_view();
    view! {
        <svg id="mohr-svg" class="mohr" class:narrow=narrow viewBox=format!("0 0 {} {}", p.size.width, p.size.height) role="img"
            aria-label="Mohr's circles of the stress state"
            data-origin-x=p.view.ox data-origin-y=p.view.oy data-px-per-unit=p.view.k>
            <defs>
                <clipPath id="plot-clip"><rect x=f.left y=f.top width=f.width height=f.height/></clipPath>
            </defs>
            <rect class="plot-bg" x=f.left y=f.top width=f.width height=f.height/>
            {sticks}
            {tticks}
            <line class="axis" x1=f.left y1=axis_y x2=f.left + f.width y2=axis_y/>
            <line class="axis" x1=p.tau_axis_x y1=f.top x2=p.tau_axis_x y2=f.top + f.height/>
            <g clip-path="url(#plot-clip)">
                {circles}
                {line(p.xy_diameter, "diameter xy")}
                {line(p.diameter, "diameter turned")}
                {points}
            </g>
            <text class="axis-label" x=f.left + f.width y=f.top + f.height + 34.0 text-anchor="end">{p.sigma_label.clone()}</text>
            <text class="axis-label" id="tau-axis-label" x=f.left y=f.top - 12.0>{p.tau_label.clone()}</text>
        </svg>
        <p class="hint" id="circle-legend">{p.legend}</p>
        <p class="hint" id="rotation-note">{format!("Shear axis: {}.", p.rotation_note)}</p>
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn circles_match_core_through_the_viewport() {
        let e = CaseForm::demo().evaluate().unwrap();
        let p = picture(&e);
        let c13 = p.circles.iter().find(|c| c.role == "c13").unwrap();
        assert!((p.view.sigma_at(c13.cx) - e.mohr3d.c13.centre).abs() < 1e-9);
        assert!((c13.r / p.view.k - e.mohr3d.c13.radius).abs() < 1e-9);
        // Everything fits in the frame.
        for c in &p.circles {
            assert!(
                c.cx - c.r >= FRAME.left - 1e-6 && c.cx + c.r <= FRAME.left + FRAME.width + 1e-6
            );
            assert!(
                c.cy - c.r >= FRAME.top - 1e-6 && c.cy + c.r <= FRAME.top + FRAME.height + 1e-6
            );
        }
    }

    #[test]
    fn principal_and_shear_points_are_labelled_with_value_and_unit() {
        for mode in [Mode::Plane, Mode::Full] {
            let mut f = CaseForm::demo();
            f.mode = mode;
            let e = f.evaluate().unwrap();
            let p = picture(&e);
            let [s1, s2, s3] = e.principal.values();
            for (role, v) in [
                ("s1", s1),
                ("s2", s2),
                ("s3", s3),
                ("tmax", e.mohr3d.tau_max()),
            ] {
                let m = p
                    .points
                    .iter()
                    .find(|m| m.role == role)
                    .unwrap_or_else(|| panic!("{mode:?}: no {role}"));
                assert!(
                    m.label.contains(&format_sig(v, 4)) && m.label.ends_with("MPa"),
                    "{role}: {}",
                    m.label
                );
            }
            for role in ["X", "Y", "Xt", "Yt", "N"] {
                assert!(
                    p.points.iter().any(|m| m.role == role),
                    "{mode:?}: no {role}"
                );
            }
        }
    }

    #[test]
    fn shear_axis_flips_the_x_point() {
        let mut f = CaseForm::demo();
        let down = picture(&f.evaluate().unwrap());
        f.shear_axis = ShearAxis::PositiveUp;
        let up = picture(&f.evaluate().unwrap());
        let x = |p: &Picture| p.points.iter().find(|m| m.role == "X").unwrap().y;
        let axis = down.view.y(0.0);
        // τxy = +37 MPa: below the σ axis when positive is down (SVG y grows downward).
        assert!(x(&down) > axis && x(&up) < axis);
        assert!(down.tau_label.contains("downward") && up.tau_label.contains("upward"));
    }

    #[test]
    fn any_magnitude_fits() {
        for v in ["1e-150", "1e150", "0"] {
            let mut f = CaseForm::demo();
            f.set_stress([
                v.into(),
                v.into(),
                "0".into(),
                v.into(),
                "0".into(),
                "0".into(),
            ]);
            let p = picture(&f.evaluate().unwrap());
            for c in &p.circles {
                assert!(c.cx.is_finite() && c.r.is_finite());
                assert!(c.cx + c.r <= FRAME.left + FRAME.width + 1e-6, "{v}");
            }
            assert!(!p.sigma_ticks.is_empty());
        }
    }
}
