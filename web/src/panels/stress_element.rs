//! "Element": the square element turned by θ with its normal and shear stresses drawn as arrows,
//! scaled to the largest of them and pointing the way each stress acts.

use crate::model::case::Mode;
use crate::model::evaluation::Evaluation;
use crate::model::numfmt::format_sig;
use crate::panels::export_buttons::ExportButtons;
use crate::panels::stale_notice::StaleBadge;
use leptos::prelude::*;

const SIZE: f64 = 400.0;
const C: f64 = SIZE / 2.0;
const HALF: f64 = 56.0;
const LONGEST: f64 = 74.0;

/// One arrow in pixels.
#[derive(Debug, Clone, PartialEq)]
pub struct Arrow {
    /// `sx`, `sy`, `txy` on the + face; `-` faces carry the same name with a `-` suffix.
    pub role: String,
    /// Tail.
    pub from: (f64, f64),
    /// Head.
    pub to: (f64, f64),
    /// Normal (true) or shear (false) stress.
    pub normal: bool,
}

/// The element as data.
#[derive(Debug, Clone, PartialEq)]
pub struct ElementPicture {
    /// θ in degrees, counter-clockwise.
    pub theta_deg: f64,
    /// The four corners of the square, pixels.
    pub corners: [(f64, f64); 4],
    /// Arrows; empty for a zero stress.
    pub arrows: Vec<Arrow>,
    /// Value labels with their positions.
    pub labels: Vec<(String, f64, f64)>,
    /// Pixel end of the turned x′ and y′ axes.
    pub axes: [(f64, f64); 2],
}

/// Maps element coordinates (x′ right, y′ up, pixels) to the SVG.
fn to_svg(theta: f64, x: f64, y: f64) -> (f64, f64) {
    let (s, c) = theta.sin_cos();
    (C + x * c - y * s, C - (x * s + y * c))
}

/// Builds the element picture.
#[must_use]
pub fn element_picture(e: &Evaluation) -> ElementPicture {
    let th = e.theta;
    let r = &e.rotated;
    let unit = e.unit.symbol();
    let (sx, sy, txy) = (r.sx(), r.sy(), r.txy());
    let big = sx.abs().max(sy.abs()).max(txy.abs());
    let len = |v: f64| {
        if big > 0.0 {
            LONGEST * v.abs() / big
        } else {
            0.0
        }
    };
    let p = |x: f64, y: f64| to_svg(th, x, y);
    let mut arrows = Vec::new();
    let mut push = |role: &str, from: (f64, f64), to: (f64, f64), normal: bool| {
        if big > 0.0 && (from.0 - to.0).hypot(from.1 - to.1) > 0.5 {
            arrows.push(Arrow {
                role: role.into(),
                from,
                to,
                normal,
            });
        }
    };
    // Normal stresses: outward for tension, inward for compression, on both faces.
    for (role, v, dir) in [("sx", sx, (1.0, 0.0)), ("sy", sy, (0.0, 1.0))] {
        let l = len(v);
        for (suffix, sgn) in [("", 1.0), ("-", -1.0)] {
            let base = (dir.0 * HALF * sgn, dir.1 * HALF * sgn);
            let tip = (base.0 + dir.0 * l * sgn, base.1 + dir.1 * l * sgn);
            let name = format!("{role}{suffix}");
            if v >= 0.0 {
                push(&name, p(base.0, base.1), p(tip.0, tip.1), true);
            } else {
                push(&name, p(tip.0, tip.1), p(base.0, base.1), true);
            }
        }
    }
    // Shear τx′y′: on +x′ along +y′, on +y′ along +x′, reversed on the negative faces.
    let l = len(txy) * 0.5 * txy.signum();
    let off = HALF + 8.0;
    push("txy", p(off, -l), p(off, l), false);
    push("txy-", p(-off, l), p(-off, -l), false);
    push("tyx", p(-l, off), p(l, off), false);
    push("tyx-", p(l, -off), p(-l, -off), false);

    let lab = |x: f64, y: f64| p(x, y);
    let (ax, ay) = lab(HALF + LONGEST + 18.0, 0.0);
    let (bx, by) = lab(0.0, HALF + LONGEST + 18.0);
    let (tx, ty) = lab(HALF + 22.0, HALF + 22.0);
    let labels = vec![
        (format!("σx′ = {} {unit}", format_sig(sx, 4)), ax, ay),
        (format!("σy′ = {} {unit}", format_sig(sy, 4)), bx, by),
        (format!("τx′y′ = {} {unit}", format_sig(txy, 4)), tx, ty),
    ];
    ElementPicture {
        theta_deg: th.to_degrees(),
        corners: [
            p(HALF, HALF),
            p(-HALF, HALF),
            p(-HALF, -HALF),
            p(HALF, -HALF),
        ],
        arrows,
        labels,
        axes: [p(HALF + LONGEST + 4.0, 0.0), p(0.0, HALF + LONGEST + 4.0)],
    }
}

/// The SVG element view.
#[component]
pub fn StressElement(shown: Memo<Option<Evaluation>>, stale: Memo<bool>) -> impl IntoView {
    view! {
        <section class="panel element" id="panel-element">
            <h2>"Element at θ"<StaleBadge stale=stale/></h2>
            {move || shown.with(|s| s.as_ref().map(|e| draw(e, &element_picture(e))))}
            <ExportButtons svg_id="element-svg" name="element"/>
        </section>
    }
}

fn draw(e: &Evaluation, p: &ElementPicture) -> impl IntoView {
    let corners = p
        .corners
        .iter()
        .map(|(x, y)| format!("{x:.2},{y:.2}"))
        .collect::<Vec<_>>()
        .join(" ");
    let arrows = p
        .arrows
        .iter()
        .map(|a| {
            view! {
                <line class=if a.normal { "arrow normal" } else { "arrow shear" } data-role=a.role.clone()
                    x1=a.from.0 y1=a.from.1 x2=a.to.0 y2=a.to.1
                    marker-end=if a.normal { "url(#head-normal)" } else { "url(#head-shear)" }/>
            }
        })
        .collect_view();
    let labels = p
        .labels
        .iter()
        .map(|(t, x, y)| view! { <text class="value" x=*x y=*y text-anchor="middle">{t.clone()}</text> })
        .collect_view();
    let out_of_plane = (e.mode == Mode::Full).then(|| {
        let r = &e.rotated;
        let u = e.unit.symbol();
        view! {
            <p class="hint" id="element-3d-note">
                {format!(
                    "Also acting (not drawn): σz = {} {u}, τx′z = {} {u}, τy′z = {} {u}.",
                    format_sig(r.sz(), 4),
                    format_sig(r.tzx(), 4),
                    format_sig(r.tyz(), 4)
                )}
            </p>
        }
    });
    let [(x1, y1), (x2, y2)] = p.axes;
    view! {
        <svg id="element-svg" class="element" viewBox=format!("0 0 {SIZE} {SIZE}") role="img"
            aria-label="Stress element turned by θ" data-theta-deg=p.theta_deg>
            <defs>
                <marker id="head-normal" viewBox="0 0 10 10" refX="9" refY="5" markerWidth="7" markerHeight="7" orient="auto-start-reverse">
                    <path d="M0,0 L10,5 L0,10 z" class="head normal"/>
                </marker>
                <marker id="head-shear" viewBox="0 0 10 10" refX="9" refY="5" markerWidth="7" markerHeight="7" orient="auto-start-reverse">
                    <path d="M0,0 L10,5 L0,10 z" class="head shear"/>
                </marker>
            </defs>
            <line class="ref-axis" x1=C y1=C x2=C + 150.0 y2=C/>
            <line class="ref-axis" x1=C y1=C x2=C y2=C - 150.0/>
            <text class="ref-label" x=C + 152.0 y=C + 4.0>"x"</text>
            <text class="ref-label" x=C - 4.0 y=C - 154.0>"y"</text>
            <line class="turned-axis" x1=C y1=C x2=x1 y2=y1/>
            <line class="turned-axis" x1=C y1=C x2=x2 y2=y2/>
            <text class="turned-label" x=x1 + 4.0 y=y1 - 4.0>"x′"</text>
            <text class="turned-label" x=x2 + 4.0 y=y2 - 4.0>"y′"</text>
            <polygon class="square" points=corners/>
            {arrows}
            {labels}
            <text class="theta-label" x="10" y=SIZE - 12.0>{format!("θ = {}° counter-clockwise", format_sig(p.theta_deg, 4))}</text>
        </svg>
        {out_of_plane}
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::model::case::{CaseForm, Field};

    fn form_with(sx: &str, sy: &str, txy: &str, angle: &str) -> Evaluation {
        let mut f = CaseForm::demo();
        f.set_text(Field::Sx, sx.into());
        f.set_text(Field::Sy, sy.into());
        f.set_text(Field::Txy, txy.into());
        f.set_text(Field::Angle, angle.into());
        f.evaluate().unwrap()
    }

    #[test]
    fn tension_points_out_and_compression_in() {
        let p = element_picture(&form_with("10", "-10", "0", "0"));
        let sx = p.arrows.iter().find(|a| a.role == "sx").unwrap();
        assert!(sx.to.0 > sx.from.0, "tension on +x points right");
        let sy = p.arrows.iter().find(|a| a.role == "sy").unwrap();
        assert!(
            sy.to.1 > sy.from.1,
            "compression on +y points down toward the face"
        );
        assert!(p.arrows.iter().all(|a| a.normal));
    }

    #[test]
    fn positive_shear_on_plus_x_points_up() {
        let p = element_picture(&form_with("0", "0", "5", "0"));
        let t = p.arrows.iter().find(|a| a.role == "txy").unwrap();
        assert!(
            t.to.1 < t.from.1,
            "+τxy on the +x face acts in +y (up on screen)"
        );
    }

    #[test]
    fn turning_by_90_degrees_moves_the_x_face_up() {
        let p = element_picture(&form_with("0", "10", "0", "90"));
        let sx = p.arrows.iter().find(|a| a.role == "sx").unwrap();
        assert!((sx.from.0 - C).abs() < 1e-9 && sx.from.1 < C);
    }

    #[test]
    fn zero_stress_draws_no_arrows() {
        assert!(element_picture(&form_with("0", "0", "0", "10"))
            .arrows
            .is_empty());
    }
}
