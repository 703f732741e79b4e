//! "Strain-gauge rosette": layout, gauge angles and readings, the transverse-sensitivity
//! correction, and a sketch of the rosette as entered (angles from core's reduction).

use crate::model::case::CaseForm;
use crate::model::choices::{tokens, Source, MAX_GAUGES};
use crate::model::evaluation::Evaluation;
use crate::model::inputs::Place;
use crate::model::numfmt::format_sig;
use crate::model::source::Outcome;
use crate::panels::choice_select::ChoiceSelect;
use crate::panels::elastic_entry::ElasticNote;
use crate::panels::number_field::SourceFields;
use crate::panels::shared_case::SharedCase;
use leptos::prelude::*;
use stresscase_core::rosette::Gauge;
use stresscase_core::units::StrainUnit;
use stresscase_core::AngleUnit;

/// One gauge line of the sketch, in a 200 × 200 box centred at (100, 100), y up on paper.
#[derive(Debug, Clone, PartialEq)]
pub struct GaugeMark {
    /// 1-based gauge number.
    pub number: usize,
    /// Line end points (x1, y1, x2, y2) in pixels.
    pub line: [f64; 4],
    /// Label position.
    pub label_at: (f64, f64),
    /// Label text: number and angle.
    pub label: String,
}

/// The sketch's gauge lines: each gauge is drawn along its direction, counter-clockwise from x.
#[must_use]
pub fn sketch(gauges: &[Gauge], au: AngleUnit) -> Vec<GaugeMark> {
    gauges
        .iter()
        .enumerate()
        .map(|(i, g)| {
            // Screen y grows downwards, so a counter-clockwise angle has a negative y offset.
            let (s, c) = g.angle.sin_cos();
            let (r0, r1, rl) = (22.0, 74.0, 88.0);
            let a = au.from_radians(g.angle);
            let label = match au {
                AngleUnit::Degree => format!("{} ({}°)", i + 1, format_sig(a, 3)),
                AngleUnit::Radian => format!("{} ({} rad)", i + 1, format_sig(a, 3)),
            };
            GaugeMark {
                number: i + 1,
                line: [
                    100.0 + r0 * c,
                    100.0 - r0 * s,
                    100.0 + r1 * c,
                    100.0 - r1 * s,
                ],
                label_at: (100.0 + rl * c, 100.0 - rl * s + 4.0),
                label,
            }
        })
        .collect()
}

/// The panel (shown when the stress comes from a rosette).
#[component]
pub fn RosetteEntry(
    form: RwSignal<CaseForm>,
    shown: Memo<Option<Evaluation>>,
    stale: Memo<bool>,
) -> impl IntoView {
    let choices = SharedCase::of(form).choices;
    let on = Memo::new(move |_| choices.with(|c| c.source == Source::Rosette));
    let custom =
        Memo::new(move |_| choices.with(|c| c.layout == crate::model::choices::Layout::Custom));
    let correct = Memo::new(move |_| choices.with(|c| c.correct));
    let marks = Memo::new(move |_| {
        shown.with(|e| match e.as_ref().map(|e| (&e.outcome, e.angle_unit)) {
            Some((Some(Outcome::Rosette(r)), au)) => sketch(&r.gauges, au),
            _ => vec![],
        })
    });
    move || {
        on.get().then(|| {
            view! {
                <fieldset class="panel" id="panel-rosette">
                    <legend><h2 class="panel-title">"Strain-gauge rosette"</h2></legend>
                    <ChoiceSelect form=form id="rosette-layout" label="Layout"
                        options=vec![("rect", "rectangular 0°/45°/90°"), ("delta", "delta 0°/60°/120°"), ("any", "any angles, 3 to 8 gauges")]
                        get=|f| tokens::token(&tokens::LAYOUT, f.choices.layout)
                        set=|f, v| if let Some(l) = tokens::value(&tokens::LAYOUT, v) { f.choices.layout = l; }/>
                    {move || custom.get().then(|| view! {
                        <ChoiceSelect form=form id="gauge-count" label="gauges"
                            options=vec![("3", "3"), ("4", "4"), ("5", "5"), ("6", "6"), ("7", "7"), ("8", "8")]
                            get=|f| ["3", "3", "3", "3", "4", "5", "6", "7", "8"][usize::from(f.choices.gauge_count())]
                            set={|f, v| if let Ok(n) = v.parse::<u8>() { f.choices.gauges = n.clamp(3, MAX_GAUGES); }}/>
                    })}
                    <ChoiceSelect form=form id="strain-unit" label="readings in"
                        options=vec![("ue", "µε (microstrain)"), ("strain", "strain (m/m)")]
                        get=|f| f.choices.strain_unit.token()
                        set=|f, v| if let Some(u) = StrainUnit::from_token(v) { f.change_strain_unit(u); }/>
                    <SourceFields form=form place=Place::Gauges/>
                    <label class="check">
                        <input type="checkbox" id="transverse-on"
                            prop:checked=move || correct.get()
                            on:change:target=move |ev| form.update(|f| f.choices.correct = ev.target().checked())/>
                        " correct for transverse sensitivity"
                    </label>
                    <SourceFields form=form place=Place::GaugeCorrection/>
                    <svg class="rosette-sketch" id="rosette-svg" viewBox="0 0 200 200" role="img" aria-label="the rosette as entered">
                        <line class="axis" x1="14" y1="100" x2="188" y2="100"/>
                        <polygon class="arrow" points="188,100 180,96 180,104"/>
                        <text x="186" y="116" text-anchor="end">"x"</text>
                        <line class="axis" x1="100" y1="186" x2="100" y2="12"/>
                        <polygon class="arrow" points="100,12 96,20 104,20"/>
                        <text x="108" y="16">"y"</text>
                        {move || marks.get().into_iter().map(|m| view! {
                            <g class="gauge" data-gauge=m.number>
                                <line x1=m.line[0] y1=m.line[1] x2=m.line[2] y2=m.line[3]/>
                                <text x=m.label_at.0 y=m.label_at.1 text-anchor="middle">{m.label}</text>
                            </g>
                        }).collect_view()}
                    </svg>
                    <ElasticNote shown=shown stale=stale id="elastic-used"/>
                    <p class="hint">"Gauge angles are measured counter-clockwise from x towards y, as sketched. Readings are taken as temperature-compensated; the stresses use plane-stress Hooke's law with the E and ν above. With four or more gauges the fit is least squares and each gauge's residual is listed in the results: a large one points at a bad gauge or a non-uniform field."</p>
                </fieldset>
            }
        })
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_sketch_turns_counter_clockwise_from_x() {
        let g = [
            Gauge {
                angle: 0.0,
                strain: 0.0,
            },
            Gauge {
                angle: core::f64::consts::FRAC_PI_2,
                strain: 0.0,
            },
        ];
        let m = sketch(&g, AngleUnit::Degree);
        assert!(m[0].line[2] > 100.0 && (m[0].line[3] - 100.0).abs() < 1e-9);
        // 90°: straight up on screen (smaller y).
        assert!(m[1].line[3] < 100.0 && (m[1].line[2] - 100.0).abs() < 1e-9);
        assert_eq!(m[1].label, "2 (90.0°)");
    }
}
