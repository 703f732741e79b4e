//! "Mohr's circle of strain": the in-plane strain circle of a rosette, drawn like the stress
//! diagram (ε along the axis, γ/2 on the other, same shear-axis choice), with each gauge's
//! direction on the circle (filled) and its reading (open) so a residual shows as a gap.

use crate::model::evaluation::Evaluation;
use crate::model::numfmt::format_sig;
use crate::model::source::Outcome;
use crate::panels::export_buttons::ExportButtons;
use crate::panels::plot::{nice_ticks, Frame, Viewport};
use crate::panels::stale_notice::StaleBadge;
use leptos::prelude::*;
use stresscase_core::MohrCircle;

const W: f64 = 420.0;
const H: f64 = 300.0;
const FRAME: Frame = Frame {
    left: 40.0,
    top: 20.0,
    width: 360.0,
    height: 240.0,
};

/// A gauge on the strain circle.
#[derive(Debug, Clone, PartialEq)]
pub struct GaugePoint {
    /// 1-based number.
    pub number: usize,
    /// Pixel position of the direction on the circle (fit).
    pub fit: (f64, f64),
    /// Pixel x of the reading (same height).
    pub reading_x: f64,
}

/// The strain circle as data.
#[derive(Debug, Clone, PartialEq)]
pub struct Picture {
    /// Map from (ε, γ/2) in the shown strain unit to pixels.
    pub view: Viewport,
    /// Circle (cx, cy, r) in pixels.
    pub circle: (f64, f64, f64),
    /// Gauge points.
    pub gauges: Vec<GaugePoint>,
    /// ε-axis ticks (pixel x, label).
    pub ticks: Vec<(f64, String)>,
    /// Axis labels.
    pub labels: (String, String),
}

/// Builds the picture from an evaluation whose source is a rosette.
#[must_use]
pub fn picture(e: &Evaluation) -> Option<Picture> {
    let Some(Outcome::Rosette(r)) = &e.outcome else {
        return None;
    };
    let s = &r.strain;
    let su = e.choices.strain_unit;
    let k = 1.0 / su.factor();
    let (e1, e2) = (s.principal[0] * k, s.principal[1] * k);
    let circle = MohrCircle::through(e1, e2);
    let (c, rad) = (circle.centre, circle.radius);
    let mut lo = e2.min(0.0);
    let mut hi = e1.max(0.0);
    for g in &r.gauges {
        lo = lo.min(g.strain * k);
        hi = hi.max(g.strain * k);
    }
    let pad = 0.08 * (hi - lo).max(2.0 * rad).max(f64::MIN_POSITIVE);
    let view = Viewport::fit(lo - pad, hi + pad, -rad - pad, rad + pad, FRAME);
    let axis = e.shear_axis;
    let gauges = r
        .gauges
        .iter()
        .enumerate()
        .filter_map(|(i, g)| {
            let (eps, half) = s.on_direction(g.angle).ok()?;
            let y = view.y(axis.height(half * k));
            Some(GaugePoint {
                number: i + 1,
                fit: (view.x(eps * k), y),
                reading_x: view.x(g.strain * k),
            })
        })
        .collect();
    let ticks = nice_ticks(lo - pad, hi + pad, 6)
        .into_iter()
        .map(|v| (view.x(v), format_sig(v, 3)))
        .collect();
    Some(Picture {
        view,
        circle: (view.x(c), view.y(0.0), rad * view.k),
        gauges,
        ticks,
        labels: (
            format!("ε ({})", su.symbol()),
            format!("γ/2 ({}), {}", su.symbol(), axis.direction()),
        ),
    })
}

/// The strain circle panel (only for a rosette).
#[component]
pub fn StrainCircle(shown: Memo<Option<Evaluation>>, stale: Memo<bool>) -> impl IntoView {
    let pic = Memo::new(move |_| shown.with(|e| e.as_ref().and_then(picture)));
    move || {
        pic.get().map(|p| {
            let (cx, cy, r) = p.circle;
            let ticks = p.ticks.iter().map(|(x, t)| view! {
                <g class="tick"><line x1=*x x2=*x y1=cy - 4.0 y2=cy + 4.0/><text x=*x y=cy + 16.0 text-anchor="middle">{t.clone()}</text></g>
            }).collect_view();
            let gauges = p.gauges.iter().map(|g| view! {
                <g class="gauge-point" data-gauge=g.number>
                    <line class="residual" x1=g.fit.0 y1=g.fit.1 x2=g.reading_x y2=g.fit.1/>
                    <circle class="fit" cx=g.fit.0 cy=g.fit.1 r="4.5"/>
                    <circle class="reading" cx=g.reading_x cy=g.fit.1 r="6"/>
                    <text x=g.fit.0 + 7.0 y=g.fit.1 - 7.0>{g.number.to_string()}</text>
                </g>
            }).collect_view();
            view! {
                <figure class="panel strain-circle" id="panel-strain-circle">
                    <h2>"Mohr's circle of strain"<StaleBadge stale=stale/></h2>
                    <svg id="strain-svg" viewBox=format!("0 0 {W} {H}") role="img" aria-label="Mohr's circle of strain"
                        data-origin-x=p.view.ox data-origin-y=p.view.oy data-px-per-unit=p.view.k>
                        <line class="axis" x1=FRAME.left x2=FRAME.left + FRAME.width y1=cy y2=cy/>
                        <line class="axis" x1=p.view.x(0.0) x2=p.view.x(0.0) y1=FRAME.top y2=FRAME.top + FRAME.height/>
                        {ticks}
                        <circle class="circle" data-role="strain" cx=cx cy=cy r=r/>
                        {gauges}
                        <text class="axis-label" x=FRAME.left + FRAME.width y=cy - 6.0 text-anchor="end">{p.labels.0.clone()}</text>
                        <text class="axis-label" x=p.view.x(0.0) + 6.0 y=FRAME.top + 10.0>{p.labels.1.clone()}</text>
                    </svg>
                    <figcaption>"Filled: each gauge direction on the fitted circle. Open: the gauge's reading. A gap between them is that gauge's residual."</figcaption>
                    <ExportButtons svg_id="strain-svg" name="strain-circle"/>
                </figure>
            }
        })
    }
}
