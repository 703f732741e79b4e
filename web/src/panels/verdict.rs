//! "Will it hold?": the material, the required factor of safety, every static criterion's factor
//! of safety with pass or fail, the criterion in use, and the failure envelopes in the plane of
//! the principal stresses with the load line from the origin through the point.
//!
//! [`picture`] builds the envelope plot as plain data (tested natively); the `<svg>` carries its
//! map as `data-origin-x`, `data-origin-y` and `data-px-per-unit`.

use crate::model::case::{CaseForm, Field, Mode};
use crate::model::choices::{tokens, ElasticFrom, MaterialPick};
use crate::model::evaluation::Evaluation;
use crate::model::inputs::{Num, Place};
use crate::model::judge::Judgement;
use crate::model::numfmt::{format_for_entry, format_sig, RESULT_DIGITS};
use crate::panels::choice_select::ChoiceSelect;
use crate::panels::export_buttons::ExportButtons;
use crate::panels::number_field::SourceFields;
use crate::panels::plot::{nice_ticks, Frame, Viewport};
use crate::panels::shared_case::SharedCase;
use crate::panels::stale_notice::StaleBadge;
use leptos::prelude::*;
use stresscase_core::criteria::{self, Criterion, MohrBranch};
use stresscase_core::material::{self, Basis};
use stresscase_core::StressUnit;

const SIZE: f64 = 440.0;
const FRAME: Frame = Frame {
    left: 44.0,
    top: 16.0,
    width: 380.0,
    height: 380.0,
};

/// One envelope as drawn.
#[derive(Debug, Clone, PartialEq)]
pub struct EnvelopeLine {
    /// The criterion.
    pub criterion: Criterion,
    /// SVG points.
    pub points: String,
    /// Drawn heavier: the criterion in use.
    pub in_use: bool,
    /// Drawn dashed: a criterion that does not apply to the material (a reference figure).
    pub reference: bool,
}

/// The envelope plot as data.
#[derive(Debug, Clone, PartialEq)]
pub struct Picture {
    /// Stress → pixel map (σA to the right, σB up).
    pub view: Viewport,
    /// Envelopes.
    pub envelopes: Vec<EnvelopeLine>,
    /// The stress point (σA, σB) in pixels, when the state is plane.
    pub point: Option<(f64, f64)>,
    /// The load line's far end on the envelope in use, in pixels.
    pub load_end: Option<(f64, f64)>,
    /// Ticks on both axes: (stress value, pixel x on the σA axis, pixel y on the σB axis, label).
    pub ticks: Vec<(f64, f64, f64, String)>,
}

/// Builds the envelope plot for a judgement and the in-plane principal stresses (σA, σB) of a
/// plane state (`None` for a 3D state).
#[must_use]
pub fn picture(j: &Judgement, plane: Option<(f64, f64)>) -> Picture {
    let mut lines = Vec::new();
    let mut extent = 0.0_f64;
    for v in &j.verdicts {
        if let Ok(pts) = criteria::envelope(v.criterion, &j.strengths, 240) {
            for (a, b) in &pts {
                extent = extent.max(a.abs()).max(b.abs());
            }
            lines.push((v.criterion, !v.judged && v.criterion != j.in_use, pts));
        }
    }
    let n_use = j.in_use_verdict().and_then(|v| v.factor);
    if let Some((a, b)) = plane {
        extent = extent.max(a.abs()).max(b.abs());
        if let Some(n) = n_use {
            extent = extent.max((a * n).abs()).max((b * n).abs());
        }
    }
    let e = if extent.is_finite() && extent > 0.0 {
        extent * 1.08
    } else {
        1.0
    };
    let view = Viewport::fit(-e, e, -e, e, FRAME);
    let envelopes = lines
        .into_iter()
        .map(|(c, reference, pts)| EnvelopeLine {
            criterion: c,
            reference,
            points: pts
                .iter()
                .map(|(a, b)| format!("{:.2},{:.2}", view.x(*a), view.y(*b)))
                .collect::<Vec<_>>()
                .join(" "),
            in_use: c == j.in_use,
        })
        .collect();
    let point = plane.map(|(a, b)| (view.x(a), view.y(b)));
    let load_end = plane
        .zip(n_use)
        .map(|((a, b), n)| (view.x(a * n), view.y(b * n)));
    let ticks = nice_ticks(-e, e, 6)
        .into_iter()
        .filter(|v| *v != 0.0)
        .map(|v| (v, view.x(v), view.y(v), format_sig(v, 3)))
        .collect();
    Picture {
        view,
        envelopes,
        point,
        load_end,
        ticks,
    }
}

fn css(c: Criterion) -> &'static str {
    c.key()
}

/// Copies a built-in row into the user's own material (MPa) so it can be edited.
fn edit_as_own(f: &mut CaseForm) {
    if let MaterialPick::Table(i) = f.choices.material {
        if let Some(m) = material::TABLE.get(i) {
            f.choices.strength_unit = StressUnit::MPa;
            let opt = |v: Option<f64>| v.map(format_for_entry).unwrap_or_default();
            f.set_text(Field::Src(Num::MatSy), opt(m.sy));
            f.set_text(Field::Src(Num::MatSut), format_for_entry(m.sut));
            f.set_text(Field::Src(Num::MatSuc), opt(m.suc));
            f.set_text(Field::Src(Num::MatElong), format_for_entry(m.elongation));
            // Its E, ν and α become typed values, so nothing the case computes changes.
            f.set_elastic(ElasticFrom::Typed);
            f.choices.material = MaterialPick::Own;
        }
    }
}

fn material_options() -> Vec<(&'static str, &'static str)> {
    let mut v: Vec<(&'static str, &'static str)> =
        material::TABLE.iter().map(|m| (m.key, m.name)).collect();
    v.push(("own", "my own material (type its strengths)"));
    v
}

/// The panel.
#[component]
pub fn Verdict(
    form: RwSignal<CaseForm>,
    shown: Memo<Option<Evaluation>>,
    stale: Memo<bool>,
) -> impl IntoView {
    let choices = SharedCase::of(form).choices;
    let own = Memo::new(move |_| choices.with(|c| c.material == MaterialPick::Own));
    let data = Memo::new(move |_| {
        shown.with(|e| {
            e.as_ref().map(|e| {
                let plane =
                    (e.mode == Mode::Plane).then_some((e.in_plane.sigma_a, e.in_plane.sigma_b));
                let branch = MohrBranch::of(e.principal.values());
                (
                    e.judgement.clone(),
                    e.unit,
                    picture(&e.judgement, plane),
                    branch,
                )
            })
        })
    });
    let about = move || {
        data.with(|d| {
            d.as_ref().map(|(j, u, _, _)| {
                let u = u.symbol();
                let s = &j.strengths;
                let fmt = |v: Option<f64>| {
                    v.map_or_else(|| "—".to_string(), |v| format!("{} {u}", format_sig(v, 4)))
                };
                let basis = match j.basis {
                    Some(Basis::Typical) => "typical values",
                    Some(Basis::Minimum) => "specified minimum values",
                    None => "your values",
                };
                format!(
                    "Sy {}, Sut {}, Suc {}, elongation {} % ({}); {} — {}.",
                    fmt(s.yield_strength()),
                    fmt(Some(s.ultimate_tensile())),
                    fmt(s.ultimate_compressive()),
                    format_sig(s.elongation(), 3),
                    if s.is_ductile() { "ductile" } else { "brittle" },
                    basis,
                    j.source.unwrap_or("entered by you"),
                )
            })
        })
    };
    let table = move || {
        data.with(|d| {
            d.as_ref().map(|(j, _, _, branch)| {
                j.verdicts
                    .iter()
                    .map(|v| {
                        let key = format!("n_{}", v.criterion.key());
                        let raw = v.factor.map(|n| format!("{n:e}")).unwrap_or_default();
                        let n_text = v.factor.map_or_else(
                            || "∞ (unloaded)".to_string(),
                            |n| format_sig(n, RESULT_DIGITS),
                        );
                        // Judged: it applies to the material, or the user chose it.
                        let judged = v.judged || v.criterion == j.in_use;
                        let verdict = if !judged {
                            "reference only"
                        } else if v.passes {
                            "passes"
                        } else {
                            "FAILS"
                        };
                        let margin = v.margin.filter(|_| judged).map_or_else(String::new, |m| {
                            format!(
                                "{}{} %",
                                if m >= 0.0 { "+" } else { "" },
                                format_sig(100.0 * m, 3)
                            )
                        });
                        let mut note = String::new();
                        if v.criterion == j.suggested {
                            note.push_str(" (suggested)");
                        }
                        if !v.judged {
                            note.push_str(if j.strengths.is_ductile() {
                                " — a brittle-material criterion; this material is ductile"
                            } else {
                                " — a ductile-material criterion; this material is brittle"
                            });
                        }
                        let mut assumptions: Vec<&str> =
                            criteria::assumption(v.criterion, &j.strengths).into_iter().collect();
                        if v.criterion == Criterion::ModifiedMohr {
                            assumptions.push(branch.describe());
                        }
                        let assumption_text = assumptions.join("; ");
                        view! {
                            <tr class:in-use=v.criterion == j.in_use class:fails=judged && !v.passes class:reference=!judged
                                data-criterion=v.criterion.key() data-judged=if judged { "true" } else { "false" }>
                                <th scope="row">{v.criterion.name()}{note}
                                    {(!assumption_text.is_empty()).then(|| view! { <span class="assumption">{assumption_text.clone()}</span> })}
                                </th>
                                <td class="num" data-key=key data-value=raw>{n_text}</td>
                                <td class="verdict">{verdict}</td>
                                <td class="num">{margin}</td>
                            </tr>
                        }
                    })
                    .collect_view()
            })
        })
    };
    let headline = move || {
        data.with(|d| {
            d.as_ref().map(|(j, _, _, _)| match j.in_use_verdict() {
                Some(v) => {
                    let n = v.factor.map_or_else(|| "∞".into(), |n| format_sig(n, 3));
                    format!(
                        "{}: n = {n} against the required {} — {}.",
                        j.in_use.name(),
                        format_sig(j.required, 3),
                        if v.passes { "passes" } else { "does not pass" }
                    )
                }
                None => format!(
                    "{} does not apply to {} (no yield strength); pick a brittle criterion.",
                    j.in_use.name(),
                    j.name
                ),
            })
        })
    };
    let plot = move || {
        data.with(|d| {
            d.as_ref().map(|(_, u, p, _)| {
                let u = u.symbol();
                let (ox, oy) = (p.view.x(0.0), p.view.y(0.0));
                let lines = p.envelopes.iter().map(|l| view! {
                    <polyline class=format!("envelope {}", css(l.criterion)) class:in-use=l.in_use class:reference=l.reference
                        data-criterion=l.criterion.key() points=l.points.clone()/>
                }).collect_view();
                let ticks = p.ticks.iter().map(|(_, x, y, t)| view! {
                    <g class="tick">
                        <line x1=*x x2=*x y1=oy - 3.0 y2=oy + 3.0/><text x=*x y=oy + 14.0 text-anchor="middle">{t.clone()}</text>
                        <line x1=ox - 3.0 x2=ox + 3.0 y1=*y y2=*y/><text x=ox - 5.0 y=y + 4.0 text-anchor="end">{t.clone()}</text>
                    </g>
                }).collect_view();
                let load = p.load_end.map(|(x, y)| view! { <line class="load-line" id="load-line" x1=ox y1=oy x2=x y2=y/> });
                let point = p.point.map(|(x, y)| view! { <circle class="stress-point" id="stress-point" cx=x cy=y r="5"/> });
                let legend = p.envelopes.iter().map(|l| view! {
                    <li class=format!("key {}", css(l.criterion))>{l.criterion.name()}{l.reference.then_some(" (dashed: reference only)")}</li>
                }).collect_view();
                let note = p.point.is_none().then_some("The state is 3D: the plot shows plane-stress envelopes only; the factors above use all three principal stresses.");
                view! {
                    <svg id="envelope-svg" viewBox=format!("0 0 {SIZE} {SIZE}") role="img" aria-label="failure envelopes in the principal stress plane"
                        data-origin-x=p.view.ox data-origin-y=p.view.oy data-px-per-unit=p.view.k>
                        <rect class="plot-bg" x=FRAME.left y=FRAME.top width=FRAME.width height=FRAME.height/>
                        <line class="axis" x1=FRAME.left x2=FRAME.left + FRAME.width y1=oy y2=oy/>
                        <line class="axis" x1=ox x2=ox y1=FRAME.top y2=FRAME.top + FRAME.height/>
                        {ticks}{lines}{load}{point}
                        <text class="axis-label" x=FRAME.left + FRAME.width - 4.0 y=oy - 6.0 text-anchor="end">{format!("σI ({u})")}</text>
                        <text class="axis-label" x=ox + 6.0 y=FRAME.top + 12.0>{format!("σII ({u})")}</text>
                    </svg>
                    <ul class="legend">{legend}<li class="key load">"— load line: every stress scaled by n reaches the envelope in use"</li></ul>
                    <p class="hint">{note}</p>
                }
            })
        })
    };
    view! {
        <section class="panel verdict" id="panel-verdict">
            <h2>"Will it hold?"<StaleBadge stale=stale/></h2>
            <div class="verdict-grid">
                <div class="verdict-inputs">
                    <ChoiceSelect form=form id="material" label="Material" options=material_options()
                        get=|f| match f.choices.material { MaterialPick::Own => "own", MaterialPick::Table(i) => material::TABLE.get(i).map_or("own", |m| m.key) }
                        set=|f, v| f.choices.material = material::TABLE.iter().position(|m| m.key == v).map_or(MaterialPick::Own, MaterialPick::Table)/>
                    <p class="material-about" id="material-about">{about}</p>
                    <div class="buttons" hidden=move || own.get()>
                        <button type="button" id="edit-material" on:click=move |_| form.update(edit_as_own)>"Edit as my own material"</button>
                    </div>
                    <div hidden=move || !own.get()>
                        <ChoiceSelect form=form id="strength-unit" label="strengths in"
                            options=StressUnit::ALL.iter().map(|u| (u.symbol(), u.symbol())).collect()
                            get=|f| f.choices.strength_unit.symbol()
                            set=|f, v| if let Some(u) = StressUnit::from_symbol(v) { f.change_strength_unit(u); }/>
                        <SourceFields form=form place=Place::OwnMaterial/>
                    </div>
                    <SourceFields form=form place=Place::Required/>
                    <ChoiceSelect form=form id="criterion" label="Criterion in use"
                        options=vec![("auto", "as the material suggests (ductile: von Mises; brittle: modified Mohr)"), ("vm", "von Mises"), ("tresca", "Tresca"), ("normal", "maximum normal stress"), ("cm", "Coulomb–Mohr"), ("mm", "modified Mohr")]
                        get=|f| tokens::token(&tokens::CRITERION, f.choices.criterion)
                        set=|f, v| if let Some(c) = tokens::value(&tokens::CRITERION, v) { f.choices.criterion = c; }/>
                    <p class="headline" id="verdict-headline" class:stale=move || stale.get()>{headline}</p>
                    <table class="result-group criteria" id="criteria-table" class:stale=move || stale.get()>
                        <thead><tr><th>"criterion"</th><th>"n"</th><th>"verdict"</th><th>"margin"</th></tr></thead>
                        <tbody>{table}</tbody>
                    </table>
                    <p class="hint">"n is the factor by which every load (so every stress) can grow before the envelope is reached. Only the criteria for the material's kind are judged (ductile: von Mises, Tresca; brittle: maximum normal, Coulomb–Mohr, modified Mohr); the others are reference figures. Ductile means elongation of 5 % or more (common practice)."</p>
                </div>
                <figure class="envelope-plot">{plot}<ExportButtons svg_id="envelope-svg" name="envelopes"/></figure>
            </div>
            <p class="caution verdict-caution" id="verdict-caution">
                <strong>"Not a design allowable. "</strong>
                "Table values are typical or specified minimum properties recalled from handbooks, not design allowables. The required factor of safety and the allowable stresses come from the code or standard that applies to the part. These results support, and do not replace, a check by a licensed engineer."
            </p>
        </section>
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_load_line_ends_on_the_envelope_in_use() {
        let f = CaseForm::demo();
        let e = f.evaluate().unwrap();
        let plane = Some((e.in_plane.sigma_a, e.in_plane.sigma_b));
        let p = picture(&e.judgement, plane);
        let n = e.judgement.in_use_verdict().unwrap().factor.unwrap();
        let (x, y) = p.load_end.unwrap();
        let (a, b) = (p.view.sigma_at(x), p.view.height_at(y));
        assert!((a - e.in_plane.sigma_a * n).abs() < 1e-9 * a.abs().max(1.0));
        assert!((b - e.in_plane.sigma_b * n).abs() < 1e-9 * b.abs().max(1.0));
        assert_eq!(p.envelopes.iter().filter(|l| l.in_use).count(), 1);
        assert!(p.envelopes.len() >= 4);
    }

    #[test]
    fn editing_a_row_as_own_keeps_the_factors() {
        let mut f = CaseForm::demo();
        let before = f.evaluate().unwrap().judgement.verdicts;
        edit_as_own(&mut f);
        assert_eq!(f.choices.material, MaterialPick::Own);
        let after = f.evaluate().unwrap().judgement.verdicts;
        for (a, b) in before.iter().zip(&after) {
            assert_eq!(a.factor, b.factor);
        }
        // Its elastic constants became typed values equal to the row's.
        let e = f.evaluate().unwrap();
        assert!(e.elastic.from.is_none() && e.elastic.mismatch.is_none());
    }
}
