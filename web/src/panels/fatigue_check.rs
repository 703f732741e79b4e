//! "Fatigue": the cycle (the state on screen and a second one), the endurance limit given or
//! estimated with Marin factors, every fatigue criterion's factor of safety, and the fatigue
//! diagram (alternating against mean) with the envelopes, the yield line, the operating point and
//! its load line.

use crate::model::case::{CaseForm, Field};
use crate::model::choices::{tokens, Cycle, Endurance, SectionKind};
use crate::model::evaluation::Evaluation;
use crate::model::inputs::{Num, Place};
use crate::model::judge::{FatigueOutcome, Judgement};
use crate::model::numfmt::{format_for_entry, format_sig, RESULT_DIGITS};
use crate::panels::choice_select::ChoiceSelect;
use crate::panels::export_buttons::ExportButtons;
use crate::panels::number_field::SourceFields;
use crate::panels::plot::nice_ticks;
use crate::panels::shared_case::SharedCase;
use crate::panels::stale_notice::StaleBadge;
use leptos::prelude::*;
use stresscase_core::fatigue::FatigueCriterion;
use stresscase_core::StressUnit;

const W: f64 = 460.0;
const H: f64 = 300.0;
const LEFT: f64 = 56.0;
const RIGHT: f64 = 12.0;
const TOP: f64 = 12.0;
const BOTTOM: f64 = 40.0;

/// Ticks along one axis: (pixel position, label).
pub type Ticks = Vec<(f64, String)>;

/// The diagram as data.
#[derive(Debug, Clone, PartialEq)]
pub struct Picture {
    /// (criterion key, SVG points) of each envelope, the yield line included.
    pub lines: Vec<(&'static str, String)>,
    /// The operating point (σm,eq, σa,eq) in pixels.
    pub point: (f64, f64),
    /// The load line from the origin through the point to the frame, in pixels.
    pub load: [f64; 4],
    /// Pixel x of σm = 0 and pixel y of σa = 0.
    pub origin: (f64, f64),
    /// Mean-axis ticks (pixel x, label) and alternating-axis ticks (pixel y, label).
    pub ticks: (Ticks, Ticks),
    /// Stress per pixel on each axis, for tests: (σm per px, σa per px).
    pub scale: (f64, f64),
}

/// Builds the fatigue diagram.
#[must_use]
pub fn picture(j: &Judgement, f: &FatigueOutcome) -> Picture {
    let s = &j.strengths;
    let sut = s.ultimate_tensile();
    let sy = s.yield_strength();
    let m_lo = f.sm.min(0.0) * 1.1;
    let m_hi = sut.max(f.sm) * 1.05;
    let a_hi = f.se.max(sy.unwrap_or(0.0)).max(f.sa) * 1.1;
    let px = |m: f64| LEFT + (W - LEFT - RIGHT) * (m - m_lo) / (m_hi - m_lo);
    let py = |a: f64| TOP + (H - TOP - BOTTOM) * (1.0 - a / a_hi);
    let mut lines = Vec::new();
    for c in FatigueCriterion::ALL {
        let needs_sy = !matches!(c, FatigueCriterion::Goodman | FatigueCriterion::Gerber);
        if needs_sy && sy.is_none() {
            continue;
        }
        let y = sy.unwrap_or(sut);
        let end = if c == FatigueCriterion::Goodman || c == FatigueCriterion::Gerber {
            sut
        } else {
            y
        };
        let mut pts: Vec<String> = Vec::new();
        // The compressive side: the envelope stays at Se (fatigue) or Sy (first-cycle yield).
        if m_lo < 0.0 {
            let a0 = c.envelope_at(0.0, f.se, sut, y);
            pts.push(format!("{:.2},{:.2}", px(m_lo), py(a0)));
        }
        for i in 0..=60 {
            let m = end * f64::from(i) / 60.0;
            pts.push(format!(
                "{:.2},{:.2}",
                px(m),
                py(c.envelope_at(m, f.se, sut, y))
            ));
        }
        lines.push((c.key(), pts.join(" ")));
    }
    let (x0, y0) = (px(0.0), py(0.0));
    let (xp, yp) = (px(f.sm), py(f.sa));
    // Extend the load line from the origin through the point to the frame.
    let (dx, dy) = (xp - x0, yp - y0);
    let t = [
        if dx > 0.0 {
            (W - RIGHT - x0) / dx
        } else if dx < 0.0 {
            (LEFT - x0) / dx
        } else {
            f64::INFINITY
        },
        if dy < 0.0 {
            (TOP - y0) / dy
        } else {
            f64::INFINITY
        },
    ]
    .into_iter()
    .fold(f64::INFINITY, f64::min);
    let t = if t.is_finite() { t } else { 1.0 };
    let ticks_m = nice_ticks(m_lo, m_hi, 6)
        .into_iter()
        .map(|v| (px(v), format_sig(v, 3)))
        .collect();
    let ticks_a = nice_ticks(0.0, a_hi, 5)
        .into_iter()
        .map(|v| (py(v), format_sig(v, 3)))
        .collect();
    Picture {
        lines,
        point: (xp, yp),
        load: [x0, y0, x0 + t * dx, y0 + t * dy],
        origin: (x0, y0),
        ticks: (ticks_m, ticks_a),
        scale: (
            (m_hi - m_lo) / (W - LEFT - RIGHT),
            a_hi / (H - TOP - BOTTOM),
        ),
    }
}

/// Puts the state on screen into the second-state fields (as the minimum or the amplitude).
fn take_second(f: &mut CaseForm, e: &Evaluation) {
    for (i, v) in (0u8..).zip(e.tensor.components()) {
        f.set_text(Field::Src(Num::second(i)), format_for_entry(v));
    }
}

/// The panel.
#[component]
pub fn FatigueCheck(
    form: RwSignal<CaseForm>,
    shown: Memo<Option<Evaluation>>,
    stale: Memo<bool>,
) -> impl IntoView {
    let choices = SharedCase::of(form).choices;
    let on = Memo::new(move |_| choices.with(|c| c.fatigue));
    let data = Memo::new(move |_| {
        shown.with(|e| {
            e.as_ref().and_then(|e| {
                e.judgement
                    .fatigue
                    .clone()
                    .map(|f| (e.judgement.clone(), f, e.unit))
            })
        })
    });
    let rows = move || {
        data.with(|d| {
            d.as_ref().map(|(j, f, u)| {
                let u = u.symbol();
                let row = |key: &'static str, label: String, v: f64, unit: &str| {
                    view! {
                        <tr><th scope="row">{label}</th>
                        <td class="num" data-key=key data-value=format!("{v:e}")>{format!("{} {unit}", format_sig(v, RESULT_DIGITS)).trim_end().to_string()}</td></tr>
                    }
                    .into_any()
                };
                let mut v = vec![
                    row("fat_sa", "alternating equivalent σa,eq (von Mises)".into(), f.sa, u),
                    row("fat_sm", "mean equivalent σm,eq (von Mises, sign of I1)".into(), f.sm, u),
                    row("fat_se", "endurance limit Se used".into(), f.se, u),
                ];
                if let Some(nf) = f.notch {
                    v.push(row("fat_kt", "Kt of the section (normal)".into(), nf.kt, "(ratio)"));
                    v.push(row("fat_kts", "Kts of the section (shear)".into(), nf.kts, "(ratio)"));
                    if let Some((a, a_s)) = nf.neuber {
                        v.push(row("fat_sqrt_a", "Neuber's √a (bending, axial) from Sut (Shigley eq. 6-35a)".into(), a, "√mm"));
                        v.push(row("fat_sqrt_as", "Neuber's √a (torsion) from Sut (eq. 6-35b)".into(), a_s, "√mm"));
                    }
                    v.push(row("fat_q", "notch sensitivity q = 1/(1 + √a/√r)".into(), nf.q, "(ratio)"));
                    v.push(row("fat_qs", "notch sensitivity qs".into(), nf.qs, "(ratio)"));
                    v.push(row("fat_kf", "Kf = 1 + q(Kt − 1), on normal stresses".into(), nf.kf, "(ratio)"));
                    v.push(row("fat_kfs", "Kfs = 1 + qs(Kts − 1), on shear stresses".into(), nf.kfs, "(ratio)"));
                }
                if let Some((se0, m)) = f.estimate {
                    v.push(row("fat_se0", "Se′ = 0.5·Sut (steels, Sut ≤ 1400 MPa)".into(), se0, u));
                    v.push(row("fat_ka", "ka surface".into(), m.ka, "(ratio)"));
                    v.push(row("fat_kb", "kb size".into(), m.kb, "(ratio)"));
                    v.push(row("fat_kc", "kc load".into(), m.kc, "(ratio)"));
                    v.push(row("fat_kd", "kd temperature".into(), m.kd, "(ratio)"));
                    v.push(row("fat_ke", "ke reliability".into(), m.ke, "(ratio)"));
                }
                for (c, n) in &f.factors {
                    let key = match c {
                        FatigueCriterion::Goodman => "nf_goodman",
                        FatigueCriterion::Gerber => "nf_gerber",
                        FatigueCriterion::AsmeElliptic => "nf_asme",
                        FatigueCriterion::Soderberg => "nf_soderberg",
                        FatigueCriterion::FirstCycleYield => "nf_langer",
                    };
                    let judged = f.judged(*c);
                    let pass = n.is_none_or(|n| n >= j.required);
                    let text = n.map_or_else(
                        || if j.strengths.yield_strength().is_none() && !matches!(c, FatigueCriterion::Goodman | FatigueCriterion::Gerber) { "needs Sy".to_string() } else { "∞ (unloaded)".to_string() },
                        |n| if judged {
                            format!("{} — {}", format_sig(n, RESULT_DIGITS), if pass { "passes" } else { "FAILS" })
                        } else {
                            format!("{} (reference only)", format_sig(n, RESULT_DIGITS))
                        },
                    );
                    let label = if *c == f.in_use {
                        format!("n, {} (in use)", c.name())
                    } else {
                        format!("n, {}", c.name())
                    };
                    v.push(view! {
                        <tr class:fails=judged && !pass class:reference=!judged class:in-use=*c == f.in_use data-judged=if judged { "true" } else { "false" }><th scope="row">{label}</th>
                        <td class="num" data-key=key data-value=n.map(|n| format!("{n:e}")).unwrap_or_default()>{text}</td></tr>
                    }.into_any());
                }
                v.collect_view()
            })
        })
    };
    let caution = move || data.with(|d| d.as_ref().and_then(|(_, f, _)| f.caution));
    let diagram = move || {
        data.with(|d| {
            d.as_ref().map(|(j, f, u)| {
                let p = picture(j, f);
                let u = u.symbol();
                let (x0, y0) = p.origin;
                let lines = p.lines.iter().map(|(k, pts)| view! { <polyline class=format!("fat-line {k}") data-criterion=*k points=pts.clone()/> }).collect_view();
                let tm = p.ticks.0.iter().map(|(x, t)| view! { <g class="tick"><line x1=*x x2=*x y1=y0 y2=y0 + 4.0/><text x=*x y=y0 + 15.0 text-anchor="middle">{t.clone()}</text></g> }).collect_view();
                let ta = p.ticks.1.iter().map(|(y, t)| view! { <g class="tick"><line x1=LEFT - 4.0 x2=LEFT y1=*y y2=*y/><text x=LEFT - 6.0 y=y + 4.0 text-anchor="end">{t.clone()}</text></g> }).collect_view();
                view! {
                    <svg id="fatigue-svg" viewBox=format!("0 0 {W} {H}") role="img" aria-label="fatigue diagram"
                        data-sm=format!("{:e}", f.sm) data-sa=format!("{:e}", f.sa)>
                        <rect class="plot-bg" x=LEFT y=TOP width=W - LEFT - RIGHT height=H - TOP - BOTTOM/>
                        <line class="axis" x1=LEFT x2=W - RIGHT y1=y0 y2=y0/>
                        <line class="axis" x1=x0 x2=x0 y1=TOP y2=H - BOTTOM/>
                        {tm}{ta}{lines}
                        <line class="load-line" x1=p.load[0] y1=p.load[1] x2=p.load[2] y2=p.load[3]/>
                        <circle class="stress-point" id="fatigue-point" cx=p.point.0 cy=p.point.1 r="5"/>
                        <text class="axis-label" x=W - RIGHT y=H - 8.0 text-anchor="end">{format!("mean σm,eq ({u})")}</text>
                        <text class="axis-label" x=LEFT + 4.0 y=TOP + 12.0>{format!("alternating σa,eq ({u})")}</text>
                    </svg>
                    <ul class="legend">
                        <li class="key goodman">"modified Goodman"</li><li class="key gerber">"Gerber"</li>
                        <li class="key asme">"ASME-elliptic"</li><li class="key soderberg">"Soderberg"</li>
                        <li class="key langer">"first-cycle yield σa,eq + σm,eq = Sy"</li>
                        <li class="key load">"load line through the origin (σa,eq/σm,eq fixed as the loads grow)"</li>
                    </ul>
                }
            })
        })
    };
    view! {
        <section class="panel fatigue" id="panel-fatigue">
            <h2>"Fatigue"<StaleBadge stale=stale/></h2>
            <label class="check">
                <input type="checkbox" id="fatigue-on" prop:checked=move || on.get()
                    on:change:target=move |ev| form.update(|f| f.choices.fatigue = ev.target().checked())/>
                " check the point in fatigue (the state on screen is one state of the cycle)"
            </label>
            <div class="verdict-grid" hidden=move || !on.get()>
                <div class="verdict-inputs">
                    <ChoiceSelect form=form id="cycle-kind" label="Cycle"
                        options=vec![("ratio", "the state on screen is the maximum; minimum = R × maximum"), ("min", "the state on screen is the maximum; the minimum below"), ("alt", "the state on screen is the mean; the alternating amplitude below"), ("loads", "loads on a section: steady loads, and alternating loads below")]
                        get=|f| tokens::token(&tokens::CYCLE, f.choices.cycle)
                        set=|f, v| if let Some(c) = tokens::value(&tokens::CYCLE, v) { f.set_cycle(c); }/>
                    <p class="hint" id="loads-cycle-hint" hidden=move || choices.with(|c| c.section_with_loads())>"A cycle of loads is for loads on a shaft, tube or rectangle."</p>
                    <SourceFields form=form place=Place::CycleRatio/>
                    <div hidden=move || !choices.with(|c| c.loads_cycle())>
                        <label class="check" hidden=move || !form.with(|f| matches!(f.choices.kind, SectionKind::SolidRound | SectionKind::Tube))>
                            <input type="checkbox" id="rotating-shaft" prop:checked=move || choices.with(|c| c.rotating)
                                on:change:target=move |ev| form.update(|f| f.choices.rotating = ev.target().checked())/>
                            " rotating shaft: bending fully reversed, axial force, torque and pressure steady"
                        </label>
                        <SourceFields form=form place=Place::AltLoads/>
                        <p class="hint">"The loads in the section panel are the steady part; the state on screen and the static check are the peak (steady + alternating). On a rotating shaft the resultant bending moment is taken fully reversed at the point."</p>
                    </div>
                    <div hidden=move || !choices.with(|c| c.notch_fatigue())>
                        <ChoiceSelect form=form id="notch-q" label="Notch sensitivity"
                            options=vec![("typed", "q and qs typed (1: Kf = Kt, the safe side)"), ("neuber", "Neuber's equation from Sut and the notch radius (steels)")]
                            get=|f| tokens::token(&tokens::NOTCH_Q, f.choices.notch_q)
                            set=|f, v| if let Some(x) = tokens::value(&tokens::NOTCH_Q, v) { f.choices.notch_q = x; }/>
                        <SourceFields form=form place=Place::Notch/>
                    </div>
                    <div hidden=move || form.with(|f| !matches!(f.choices.cycle, Cycle::Minimum | Cycle::Alternating))>
                        <SourceFields form=form place=Place::SecondState/>
                        <div class="buttons">
                            <button type="button" id="take-second" on:click=move |_| shown.with_untracked(|e| if let Some(e) = e { form.update(|f| take_second(f, e)); })>"Take the state on screen"</button>
                        </div>
                        <p class="hint" id="second-state-hint">"Components in the case's stress unit, in the same axes as the state on screen. Nothing is filled in for you: set the loads of the other extreme, press “Take the state on screen”, then set the loads back — or type the components. Changing between minimum and amplitude clears them, because the same numbers mean something else."</p>
                    </div>
                    <ChoiceSelect form=form id="endurance-kind" label="Endurance limit"
                        options=vec![("estimate", "estimate for a steel: Se′ = 0.5 Sut with Marin factors"), ("given", "given (corrected for the part)")]
                        get=|f| tokens::token(&tokens::ENDURANCE, f.choices.endurance)
                        set=|f, v| if let Some(x) = tokens::value(&tokens::ENDURANCE, v) { f.choices.endurance = x; }/>
                    <div hidden=move || choices.with(|c| c.endurance != Endurance::Estimate)>
                        <ChoiceSelect form=form id="finish" label="surface"
                            options=vec![("ground", "ground"), ("machined", "machined or cold-drawn"), ("hotrolled", "hot-rolled"), ("forged", "as forged")]
                            get=|f| tokens::token(&tokens::FINISH, f.choices.finish)
                            set=|f, v| if let Some(x) = tokens::value(&tokens::FINISH, v) { f.choices.finish = x; }/>
                        <ChoiceSelect form=form id="loading" label="loading"
                            options=vec![("bending", "bending"), ("axial", "axial"), ("torsion", "torsion")]
                            get=|f| tokens::token(&tokens::LOADING, f.choices.loading)
                            set=|f, v| if let Some(x) = tokens::value(&tokens::LOADING, v) { f.choices.loading = x; }/>
                    </div>
                    <div hidden=move || choices.with(|c| c.endurance != Endurance::Given)>
                        <ChoiceSelect form=form id="se-unit" label="Se in"
                            options=StressUnit::ALL.iter().map(|u| (u.symbol(), u.symbol())).collect()
                            get=|f| f.choices.strength_unit.symbol()
                            set=|f, v| if let Some(u) = StressUnit::from_symbol(v) { f.change_strength_unit(u); }/>
                    </div>
                    <SourceFields form=form place=Place::Endurance/>
                    <ChoiceSelect form=form id="fatigue-criterion" label="Fatigue criterion in use"
                        options=vec![("goodman", "modified Goodman"), ("gerber", "Gerber"), ("asme", "ASME-elliptic"), ("soderberg", "Soderberg")]
                        get=|f| tokens::token(&tokens::FATIGUE_CRITERION, f.choices.fatigue_criterion)
                        set=|f, v| if let Some(x) = tokens::value(&tokens::FATIGUE_CRITERION, v) { f.choices.fatigue_criterion = x; }/>
                    <table class="result-group fatigue-results" id="fatigue-table" class:stale=move || stale.get()><tbody>{rows}</tbody></table>
                    <p class="warnings">{caution}</p>
                    <p class="hint">"The criterion in use and first-cycle yield are judged; the other criteria are reference figures. Factors use the load line through the origin. A compressive mean (σm,eq < 0) is taken as not helping: n = Se/σa,eq. Marin factors and Se′ are Shigley's correlations (ch. 6); the size factor is for rotating round sections."</p>
                </div>
                <figure class="fatigue-plot">{diagram}<ExportButtons svg_id="fatigue-svg" name="fatigue"/></figure>
            </div>
        </section>
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_operating_point_sits_at_its_equivalents() {
        let mut f = CaseForm::demo();
        f.choices.fatigue = true;
        f.set_text(Field::Src(Num::Ratio), "0".into());
        let e = f.evaluate().unwrap();
        let fo = e.judgement.fatigue.clone().unwrap();
        let p = picture(&e.judgement, &fo);
        let (x0, y0) = p.origin;
        let m = (p.point.0 - x0) * p.scale.0;
        let a = (y0 - p.point.1) * p.scale.1;
        assert!(
            (m - fo.sm).abs() < 1e-9 * fo.sm.abs().max(1.0),
            "{m} vs {}",
            fo.sm
        );
        assert!((a - fo.sa).abs() < 1e-9 * fo.sa.max(1.0));
        // R = 0: mean and amplitude are equal, so the load line is at 45° in stress.
        assert!((fo.sm - fo.sa).abs() < 1e-9 * fo.sa);
        assert_eq!(p.lines.len(), 5);
    }

    #[test]
    fn taking_the_screen_state_fills_the_second_state() {
        let mut f = CaseForm::demo();
        let e = f.evaluate().unwrap();
        take_second(&mut f, &e);
        assert_eq!(f.text(Field::Src(Num::second(0))), "84");
        assert_eq!(f.text(Field::Src(Num::second(3))), "37");
    }
}
