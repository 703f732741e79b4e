//! The calc sheet: what the browser prints (or saves as PDF). On screen these parts are hidden;
//! in print everything else but the headline, the Mohr diagram, the criteria and the results is
//! hidden. [`SheetHead`] opens page 1 with the title, the part and point, the date, the note and
//! every input with its unit; [`SheetTail`] closes the sheet with the assumptions, the sources of
//! every check, the whole case link with its QR code, and the caution.
//!
//! [`inputs`], [`assumptions`] and [`qr_path`] are plain functions, tested natively.

use crate::edge::browser;
use crate::model::case::{CaseForm, Field, Mode};
use crate::model::choices::{tokens, Cycle, Endurance, Source};
use crate::model::evaluation::Evaluation;
use crate::model::inputs::Num;
use crate::model::source::Outcome;
use crate::panels::elastic_entry::describe;
use crate::panels::shared_case::SharedCase;
use leptos::prelude::*;
use qrcode::{Color, EcLevel, QrCode};
use stresscase_core::criteria::{self, Criterion, MohrBranch};
use stresscase_core::section::SAINT_VENANT;

/// One printed input: what it is, and its value with the unit.
pub type InputLine = (String, String);

fn choice_text(f: &CaseForm) -> String {
    let c = &f.choices;
    match c.source {
        Source::Typed => match f.mode {
            Mode::Plane => "stress components, typed (plane stress)".into(),
            Mode::Full => "stress components, typed (full 3D tensor)".into(),
        },
        Source::Section => format!(
            "loads on a section: {}",
            match tokens::token(&tokens::KIND, c.kind) {
                "shaft" => "solid round shaft",
                "tube" => "tube",
                "rect" => "solid rectangle",
                "thincyl" => "thin-walled cylinder",
                _ => "thin-walled sphere",
            }
        ),
        Source::Rosette => format!(
            "strain-gauge rosette: {}",
            match tokens::token(&tokens::LAYOUT, c.layout) {
                "rect" => "rectangular 0/45/90°",
                "delta" => "delta 0/60/120°",
                _ => "gauges at the angles given",
            }
        ),
        Source::Strain => format!(
            "strains by Hooke's law: {}",
            match tokens::token(&tokens::CONDITION, c.condition) {
                "pstress" => "plane stress",
                "pstrain" => "plane strain",
                _ => "full 3D",
            }
        ),
    }
}

/// Every input of the case as printed: its label and its value with the unit.
#[must_use]
pub fn inputs(f: &CaseForm, e: &Evaluation) -> Vec<InputLine> {
    let line = |label: String, text: &str, unit: &str| {
        let value = if unit.is_empty() {
            text.to_string()
        } else if unit == "°" {
            format!("{text}°")
        } else {
            format!("{text} {unit}")
        };
        (label, value)
    };
    let mut v = vec![("where the stress comes from".to_string(), choice_text(f))];
    let c = &f.choices;
    if c.section_with_loads() && c.kt_from != crate::model::choices::KtFrom::Typed {
        v.push((
            "Kt and Kts from".into(),
            crate::panels::notch_shape::from_text(c.kt_from).into(),
        ));
    }
    for field in Field::STRESS {
        if f.is_active(field) {
            v.push(line(f.label(field), f.text(field), f.unit_of(field)));
        }
    }
    let skip_elastic = [Num::E, Num::Nu, Num::Alpha];
    for n in f.choices.active() {
        if skip_elastic.contains(&n) {
            continue;
        }
        let field = Field::Src(n);
        let text = f.text(field);
        if text.trim().is_empty() {
            continue;
        }
        v.push(line(f.label(field), text, f.unit_of(field)));
    }
    v.push((
        "elastic constants".into(),
        describe(&e.elastic, e.choices.modulus_unit),
    ));
    let j = &e.judgement;
    v.push(("material".into(), j.name.clone()));
    v.push(("static criterion in use".into(), j.in_use.name().into()));
    if let Some(fat) = &j.fatigue {
        let cycle = match f.choices.cycle {
            Cycle::Ratio => "proportional: minimum = R × the state on screen",
            Cycle::Minimum => "the state on screen is the maximum; the minimum as given",
            Cycle::Alternating => "the state on screen is the mean; the amplitude as given",
            Cycle::Loads if f.choices.rotating_shaft() => {
                "rotating shaft: bending fully reversed, axial force, torque and pressure steady"
            }
            Cycle::Loads => "loads on the section: steady loads and alternating loads as given",
        };
        v.push(("fatigue cycle".into(), cycle.into()));
        v.push((
            "endurance limit".into(),
            match f.choices.endurance {
                Endurance::Estimate => "estimated: Se′ = 0.5·Sut with Marin factors".into(),
                Endurance::Given => "given".into(),
            },
        ));
        v.push(("fatigue criterion in use".into(), fat.in_use.name().into()));
    }
    if let Some(l) = &j.life {
        v.push(("S–N line".into(), life_line_text(l)));
        v.push(("mean-stress correction".into(), l.mean_stress.name().into()));
        if let crate::model::judge::LifeResult::History(h) = &l.result {
            v.push((
                format!("load history ({} values, {})", h.points, f.unit.symbol()),
                f.history.clone(),
            ));
        }
    }
    v.push(line(
        f.label(Field::Angle),
        f.text(Field::Angle),
        f.unit_of(Field::Angle),
    ));
    v.push((
        "plane normal n (nx, ny, nz)".into(),
        format!(
            "({}, {}, {})",
            f.text(Field::Nx),
            f.text(Field::Ny),
            f.text(Field::Nz)
        ),
    ));
    v
}

/// The life in one sentence.
fn life_verdict(l: &crate::model::judge::LifeOutcome) -> String {
    use crate::model::judge::LifeResult;
    use crate::model::numfmt::format_sig;
    use stresscase_core::damage::HistoryLife;
    use stresscase_core::sn_curve::Life;
    match &l.result {
        LifeResult::Cycle(c) => match c.life {
            Some(Life::Cycles(n)) => format!("{} cycles", format_sig(n, 3)),
            Some(Life::Infinite) => "infinite (at or below the endurance limit)".into(),
            Some(Life::LowCycle) => "not given (low-cycle fatigue)".into(),
            None => c.reversed.to_string(),
        },
        LifeResult::History(h) => match h.life {
            HistoryLife::Repeats(r) => format!(
                "D = {} per history, {} repeats{}",
                format_sig(h.miner.total, 3),
                format_sig(r, 3),
                h.hours
                    .map(|t| format!(" ({} h)", format_sig(r * t, 3)))
                    .unwrap_or_default()
            ),
            HistoryLife::Infinite => "infinite (no cycle does damage)".into(),
            HistoryLife::NotGiven => "not given (some cycle is outside the S–N line)".into(),
        },
        LifeResult::Table(_) => {
            "of the table's history, shown on the page (the table is not in this case)".into()
        }
    }
}

/// The S–N line in words.
fn life_line_text(l: &crate::model::judge::LifeOutcome) -> String {
    use crate::model::judge::LineFrom;
    use crate::model::numfmt::format_sig;
    match l.from {
        LineFrom::Estimated { f } => format!(
            "through f·Sut at 10³ and Se at 10⁶ cycles, f = {} estimated (Shigley)",
            format_sig(f, 4)
        ),
        LineFrom::Fraction { f } => format!(
            "through f·Sut at 10³ and Se at 10⁶ cycles, f = {} typed",
            format_sig(f, 4)
        ),
        LineFrom::Own { .. } => "the user's Basquin curve N = Nref·(σar/Sref)^−k".into(),
    }
}

/// Every assumption that changes a number of this case, in words.
#[must_use]
pub fn assumptions(e: &Evaluation) -> Vec<String> {
    let mut v = Vec::new();
    if e.mode == Mode::Plane {
        v.push("Plane stress at the point: σz = τyz = τzx = 0.".to_string());
    }
    v.push(format!(
        "Elastic constants: {}.",
        describe(&e.elastic, e.choices.modulus_unit)
    ));
    if let Some(m) = &e.elastic.mismatch {
        v.push(m.clone());
    }
    match &e.outcome {
        Some(Outcome::Section(s)) => {
            for w in &s.warnings {
                v.push((*w).to_string());
            }
        }
        Some(Outcome::Rosette(_)) => v.push(
            "Gauge readings are taken as temperature-compensated; the stress follows from plane-stress Hooke's law."
                .into(),
        ),
        Some(Outcome::Strain(_)) | None => {}
    }
    let j = &e.judgement;
    v.push(format!(
        "The material is treated as {} (elongation {} %; 5 % or more is ductile, common practice); {} is the criterion in use.",
        if j.strengths.is_ductile() { "ductile" } else { "brittle" },
        crate::model::numfmt::format_sig(j.strengths.elongation(), 3),
        j.in_use.name()
    ));
    if let Some(a) = criteria::assumption(j.in_use, &j.strengths) {
        v.push(format!("{}: {a}.", j.in_use.name()));
    }
    if j.in_use == Criterion::ModifiedMohr {
        v.push(format!(
            "Modified Mohr: {}.",
            MohrBranch::of(e.principal.values()).describe()
        ));
    }
    v.push(
        "Factors of safety scale every load, so every stress, together (proportional loading)."
            .into(),
    );
    if let Some(f) = &j.fatigue {
        v.push("Fatigue: von Mises equivalents of the alternating and mean parts, the mean signed by I1; factors along the load line through the origin; a compressive mean is taken as not helping (n = Se/σa,eq).".into());
        if f.estimate.is_some() {
            v.push(
                "Se estimated as 0.5·Sut with Shigley's Marin factors (steels, Sut ≤ 1400 MPa)."
                    .into(),
            );
        }
        if let Some(c) = f.caution {
            v.push(c.to_string());
        }
        if let Some(nf) = f.notch {
            use crate::model::numfmt::format_sig;
            v.push(format!(
                "Notch in fatigue (common practice): the section's states use Kf = 1 + q(Kt − 1) = {} and Kfs = 1 + qs(Kts − 1) = {} (q = {}, qs = {}{}).",
                format_sig(nf.kf, 4),
                format_sig(nf.kfs, 4),
                format_sig(nf.q, 3),
                format_sig(nf.qs, 3),
                if nf.neuber.is_some() { ", Neuber's equation with Shigley's fit of √a against Sut" } else { ", typed" }
            ));
        }
    }
    if let Some(crate::model::source::Outcome::Section(s)) = &e.outcome {
        if let Some(f) = &s.shape {
            use crate::model::numfmt::format_sig;
            let line = |name: &str, fit: &stresscase_core::concentration::Fitted| {
                format!(
                    "{name} = {} from the fit for a {} at {} = {} (its range {} to {}).",
                    format_sig(fit.kt, 4),
                    fit.source,
                    fit.ratio,
                    format_sig(fit.value, 3),
                    fit.range.0,
                    fit.range.1
                )
            };
            if let Some((_, fit)) = &f.normal {
                v.push(line("Kt", fit));
            }
            if let Some(fit) = &f.shear {
                v.push(line("Kts", fit));
            }
            v.extend(f.notes.iter().map(|n| (*n).to_string()));
        }
    }
    if e.choices.source == crate::model::choices::Source::Section && e.choices.has_loads() {
        v.push(if e.choices.static_kt {
            "Kt and Kts raise the state on screen and the static check.".into()
        } else {
            "Kt and Kts are not applied to the state on screen or the static check (common practice for a ductile material, which yields locally at the notch).".into()
        });
    }
    if let Some(l) = &j.life {
        v.push(format!(
            "Life: {} correction to a fully reversed amplitude; a compressive mean is taken as not helping (common practice); Smith–Watson–Topper with σmax ≤ 0 does no damage; below 10³ cycles (low-cycle fatigue) the S–N line gives no life.",
            l.mean_stress.name()
        ));
        if matches!(l.result, crate::model::judge::LifeResult::History(_)) {
            v.push("Load history: rainflow counting per ASTM E1049-85 §5.4.4 (three-point method from the first point; ranges left at the end are half cycles) and Miner's linear damage rule, which ignores the order of the cycles.".into());
        }
    }
    v
}

/// The published sources behind the checks on the sheet.
pub const SOURCES: [&str; 9] = [
    "Principal stresses, transformation, Mohr's circles, invariants: Timoshenko & Goodier, Theory of Elasticity; Gere & Goodno, Mechanics of Materials; Malvern, Introduction to the Mechanics of a Continuous Medium.",
    "Equivalent stresses and the Lode angle: Boresi & Schmidt, Advanced Mechanics of Materials; Bai & Wierzbicki (2008).",
    "Sections and vessels: beam theory and VQ/(It) (Gere & Goodno); Saint-Venant torsion of rectangles and Lamé's thick cylinder (Timoshenko & Goodier).",
    "Rosettes and Hooke's law: Gere & Goodno; transverse sensitivity after the gauge makers' published correction.",
    "Static criteria and factors of safety: Shigley's Mechanical Engineering Design, ch. 5.",
    "Fatigue criteria, Se′ and Marin factors: Shigley's Mechanical Engineering Design, ch. 6.",
    "Stress concentration: Pilkey & Pilkey, Peterson's Stress Concentration Factors, 3rd ed. (2008), the curve fits to the charts; notch sensitivity: Neuber's equation with Shigley's fit (ch. 6).",
    "Life: Shigley's Mechanical Engineering Design, 9th ed., §6-7 and §6-14 (S–N line, mean-stress corrections); ASTM E1049-85 (2017) §5.4.4 (rainflow); Miner (1945).",
    "Unit factors: NIST SP 811.",
];

/// How long typing must pause before the printed QR code is made again.
const QR_PAUSE: std::time::Duration = std::time::Duration::from_millis(400);

/// Most bytes a QR code holds (version 40, level L, byte mode).
pub const QR_CAPACITY: usize = 2953;

/// The QR code of `text` as an SVG path in module units with a 4-module quiet zone, and the
/// side in modules; `None` when the text is too long for a QR code.
#[must_use]
pub fn qr_path(text: &str) -> Option<(String, usize)> {
    let code = QrCode::with_error_correction_level(text.as_bytes(), EcLevel::L).ok()?;
    let w = code.width();
    let mut d = String::new();
    for (i, c) in code.to_colors().into_iter().enumerate() {
        if c == Color::Dark {
            d.push_str(&format!("M{} {}h1v1h-1z", i % w + 4, i / w + 4));
        }
    }
    Some((d, w + 8))
}

/// Page 1's top: title, part and point, date, note, inputs.
#[component]
pub fn SheetHead(form: RwSignal<CaseForm>, shown: Memo<Option<Evaluation>>) -> impl IntoView {
    // The date and time of printing, not of opening the page.
    let printed = RwSignal::new(browser::now_text());
    let _ = window_event_listener_untyped("beforeprint", move |_| {
        printed.set(browser::now_text());
    });
    let rows = move || {
        shown.with(|e| {
            e.as_ref().map(|e| {
                form.with(|f| inputs(f, e))
                    .into_iter()
                    .map(|(k, v)| view! { <tr><th scope="row">{k}</th><td>{v}</td></tr> })
                    .collect_view()
            })
        })
    };
    let verdict = move || {
        shown.with(|e| {
            e.as_ref().map(|e| {
                let j = &e.judgement;
                let mut s = match j.in_use_verdict() {
                    Some(v) => format!(
                        "Static, {}: n = {} against the required {} — {}.",
                        j.in_use.name(),
                        v.factor
                            .map_or_else(|| "∞".into(), |n| crate::model::numfmt::format_sig(n, 3)),
                        crate::model::numfmt::format_sig(j.required, 3),
                        if v.passes { "passes" } else { "does not pass" }
                    ),
                    None => format!("{} does not apply to {}.", j.in_use.name(), j.name),
                };
                if let Some(f) = &j.fatigue {
                    let n = f.factor_in_use();
                    s.push_str(&format!(
                        " Fatigue, {}: n = {} — {}.",
                        f.in_use.name(),
                        n.map_or_else(|| "∞".into(), |n| crate::model::numfmt::format_sig(n, 3)),
                        if n.is_none_or(|n| n >= j.required) {
                            "passes"
                        } else {
                            "does not pass"
                        }
                    ));
                }
                if let Some(l) = &j.life {
                    s.push_str(&format!(" Life: {}.", life_verdict(l)));
                }
                s
            })
        })
    };
    view! {
        <section class="sheet-head print-only" id="sheet-head">
            <p class="sheet-brand">"Stresscase calc sheet"</p>
            <h1 class="sheet-title">{move || form.with(|f| if f.title.trim().is_empty() { "Untitled case".to_string() } else { f.title.clone() })}</h1>
            <p class="sheet-date">"Printed " {move || printed.get()}</p>
            <p class="sheet-note" hidden=move || form.with(|f| f.note.trim().is_empty())>{move || form.with(|f| f.note.clone())}</p>
            <table class="sheet-inputs"><caption>"Inputs"</caption><tbody>{rows}</tbody></table>
            <p class="sheet-verdict" id="sheet-verdict">{verdict}</p>
        </section>
    }
}

/// The sheet's end: assumptions, conventions are printed from the page, sources, link, QR, caution.
#[component]
pub fn SheetTail(form: RwSignal<CaseForm>, shown: Memo<Option<Evaluation>>) -> impl IntoView {
    let link = SharedCase::of(form).link;
    let items = move || {
        shown.with(|e| {
            e.as_ref().map(|e| {
                assumptions(e)
                    .into_iter()
                    .map(|a| view! { <li>{a}</li> })
                    .collect_view()
            })
        })
    };
    // Making a QR code takes milliseconds (it tries eight masks), and the code is only ever
    // printed: it follows the link once typing pauses (and not while the page first draws),
    // and at once before printing, so the printed code is always the printed link's.
    let qr_link = RwSignal::new(None);
    let pending = StoredValue::new(None::<TimeoutHandle>);
    let catch_up = move || {
        let now = link.get_untracked();
        if qr_link.with_untracked(|q| *q != now) {
            qr_link.set(now);
        }
    };
    Effect::new(move |_| {
        link.track();
        if let Some(h) = pending.get_value() {
            h.clear();
        }
        pending.set_value(set_timeout_with_handle(catch_up, QR_PAUSE).ok());
    });
    let _ = window_event_listener_untyped("beforeprint", move |_| catch_up());
    let qr = move || {
        qr_link.with(|l| {
            l.as_ref().map(|l| match qr_path(l) {
                Some((d, side)) => view! {
                    <svg class="qr" id="sheet-qr" viewBox=format!("0 0 {side} {side}") role="img" aria-label="QR code of the case link" data-modules=side - 8>
                        <rect width=side height=side fill="#fff"/>
                        <path d=d fill="#000"/>
                    </svg>
                }
                .into_any(),
                None => view! {
                    <p class="qr-too-long" id="sheet-qr-none">{format!(
                        "No QR code: this link is {} bytes long, more than a QR code holds ({QR_CAPACITY}). Use the printed link.",
                        l.len()
                    )}</p>
                }
                .into_any(),
            })
        })
    };
    let sources = SOURCES
        .iter()
        .map(|s| view! { <li>{*s}</li> })
        .collect_view();
    let material_source = move || {
        shown.with(|e| {
            e.as_ref().map(|e| {
                format!(
                    "Material data: {}.",
                    e.judgement.source.unwrap_or("entered by the user")
                )
            })
        })
    };
    view! {
        <section class="sheet-tail print-only" id="sheet-tail">
            <h2>"Assumptions"</h2>
            <ul class="sheet-assumptions">{items}</ul>
            <h2>"Sources of the checks"</h2>
            <ul class="sheet-sources">{sources}<li>{material_source}</li><li>{SAINT_VENANT}</li></ul>
            <h2>"The case link"</h2>
            <div class="sheet-link-row">
                <p class="sheet-link" id="sheet-link">{move || link.get().unwrap_or_default()}</p>
                {qr}
            </div>
            <p class="caution sheet-caution" id="sheet-caution">
                <strong>"Engineering aid, not a design authority. "</strong>
                "These results support, and do not replace, checks under the applicable codes and standards and review by a licensed engineer. Table values are typical or specified minimum properties recalled from handbooks, not design allowables."
            </p>
        </section>
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn every_input_is_printed_with_its_unit() {
        let f = CaseForm::demo();
        let e = f.evaluate().unwrap();
        let lines = inputs(&f, &e);
        let find = |k: &str| lines.iter().find(|(l, _)| l == k).map(|(_, v)| v.clone());
        assert_eq!(find("σx").as_deref(), Some("84 MPa"));
        assert_eq!(find("τxy").as_deref(), Some("37 MPa"));
        assert!(find("σz").is_none(), "plane stress prints no σz input");
        assert!(find("elastic constants").unwrap().contains("207 GPa"));
        assert_eq!(find("θ").as_deref(), Some("30°"));
        assert!(assumptions(&e)[0].contains("Plane stress"));
    }

    #[test]
    fn a_qr_code_holds_a_link_up_to_its_capacity() {
        let (d, side) = qr_path("https://example.invalid/#v=1&mode=plane").unwrap();
        assert!(d.starts_with('M') && side >= 21 + 8);
        assert!(qr_path(&"a".repeat(QR_CAPACITY)).is_some());
        assert!(qr_path(&"a".repeat(QR_CAPACITY + 1)).is_none());
    }
}
