//! "Kt and Kts from": typed, or a notch's shape with its published fit. Shows the shape's
//! sketch with its dimensions named, the factors the fits give (with the ratio, its range and
//! the source) and the notes on which fit is used.

use crate::model::case::CaseForm;
use crate::model::choices::{tokens, KtFrom};
use crate::model::evaluation::Evaluation;
use crate::model::numfmt::format_sig;
use crate::model::source::{Outcome, ShapeFactors};
use crate::panels::choice_select::ChoiceSelect;
use crate::panels::shared_case::SharedCase;
use crate::panels::stale_notice::StaleBadge;
use leptos::prelude::*;
use stresscase_core::concentration::Fitted;
use stresscase_core::fatigue::Loading;

/// What the choice reads, for the select and the calc sheet.
pub(crate) fn from_text(k: KtFrom) -> &'static str {
    match k {
        KtFrom::Typed => "typed below",
        KtFrom::Shoulder => "a shoulder fillet on a round bar",
        KtFrom::Groove => "a U-groove in a round bar",
        KtFrom::FlatShoulder => "shoulder fillets on a flat bar (both edges)",
        KtFrom::Hole => "a central hole in a plate (tension)",
    }
}

/// The outline of the shape (SVG path, 120 × 64 box) and its dimension labels.
fn outline(k: KtFrom) -> (&'static str, &'static [(f64, f64, &'static str)]) {
    match k {
        KtFrom::Shoulder => (
            "M4 8 H56 Q62 8 62 16 H116 V48 H62 Q62 56 56 56 H4 Z",
            &[(20.0, 35.0, "D"), (90.0, 35.0, "d"), (66.0, 13.0, "r")],
        ),
        KtFrom::Groove => (
            "M4 8 H48 V14 A12 12 0 0 0 72 14 V8 H116 V56 H72 V50 A12 12 0 0 0 48 50 V56 H4 Z",
            &[(20.0, 35.0, "D"), (60.0, 35.0, "d"), (60.0, 8.0, "r")],
        ),
        KtFrom::FlatShoulder => (
            "M4 4 H56 Q62 4 62 14 H116 V50 H62 Q62 60 56 60 H4 Z",
            &[(20.0, 35.0, "H"), (90.0, 35.0, "h"), (66.0, 11.0, "r")],
        ),
        KtFrom::Hole | KtFrom::Typed => (
            "M4 4 H116 V60 H4 Z M60 20 A12 12 0 1 0 60.01 20 Z",
            &[
                (18.0, 35.0, "W"),
                (60.0, 35.0, "d"),
                (60.0, 56.0, "h = W − d"),
            ],
        ),
    }
}

/// A small sketch of the notch's shape with its dimensions named.
#[component]
fn ShapeSketch(kind: KtFrom) -> impl IntoView {
    let (d, labels) = outline(kind);
    let labels = labels
        .iter()
        .map(|(x, y, t)| view! { <text x=*x y=*y text-anchor="middle" class="sketch-label">{*t}</text> })
        .collect_view();
    view! {
        <svg class="notch-sketch" viewBox="0 0 120 64" width="180" height="96" role="img"
            aria-label=format!("sketch: {}", from_text(kind))>
            <path d=d class="sketch-part" fill-rule="evenodd"/>
            {labels}
        </svg>
    }
}

fn loading_text(l: Loading) -> &'static str {
    match l {
        Loading::Axial => "tension",
        Loading::Bending => "bending",
        Loading::Torsion => "torsion",
    }
}

/// One factor's row: its name and the loading of its fit, and the value.
fn factor_row(
    name: &'static str,
    key: &'static str,
    v: f64,
    what: Option<&'static str>,
) -> AnyView {
    let label = match what {
        Some(w) => format!("{name} ({w} fit)"),
        None => name.to_string(),
    };
    view! {
        <tr>
            <th scope="row">{label}</th>
            <td class="num" data-key=key data-value=format!("{v:e}")>{format_sig(v, 4)}</td>
        </tr>
    }
    .into_any()
}

/// Where a fitted factor came from: the ratio, its range and the source.
fn fit_note(name: &str, f: &Fitted) -> String {
    format!(
        "{name}: {} = {} (the fit's range {} to {}); {}.",
        f.ratio,
        format_sig(f.value, 3),
        f.range.0,
        f.range.1,
        f.source
    )
}

/// The chosen shape's factors, or nothing when they are typed.
fn factors_view(f: &ShapeFactors) -> AnyView {
    let normal = factor_row("Kt", "kt-fit", f.kt, f.normal.map(|(l, _)| loading_text(l)));
    let shear = factor_row("Kts", "kts-fit", f.kts, f.shear.map(|_| "torsion"));
    let mut notes: Vec<String> = vec![];
    if let Some((_, fit)) = &f.normal {
        notes.push(fit_note("Kt", fit));
    }
    if let Some(fit) = &f.shear {
        notes.push(fit_note("Kts", fit));
    }
    notes.extend(f.notes.iter().map(|n| (*n).to_string()));
    let notes = notes
        .into_iter()
        .map(|n| view! { <li>{n}</li> })
        .collect_view();
    view! {
        <div>
            <table class="result-group fit-table"><tbody>{normal}{shear}</tbody></table>
            <ul class="hint fit-notes">{notes}</ul>
        </div>
    }
    .into_any()
}

/// The "Kt and Kts from" choice and the shape's sketch (its dimensions are typed below it).
#[component]
pub fn NotchShape(form: RwSignal<CaseForm>) -> impl IntoView {
    let choices = SharedCase::of(form).choices;
    let options: Vec<(&'static str, &'static str)> = tokens::KT_FROM
        .iter()
        .map(|(k, t)| (*t, from_text(*k)))
        .collect();
    let kind = Memo::new(move |_| choices.with(|c| c.kt_from));
    view! {
        <ChoiceSelect form=form id="kt-from" label="Kt and Kts from" options=options
            get=|f| tokens::token(&tokens::KT_FROM, f.choices.kt_from)
            set=|f, v| if let Some(k) = tokens::value(&tokens::KT_FROM, v) { f.choices.kt_from = k; }/>
        {move || {
            let k = kind.get();
            (k != KtFrom::Typed).then(|| view! {
                <div class="notch-shape">
                    <ShapeSketch kind=k/>
                    <p class="hint">"The section above is the fit's nominal section: the smaller diameter d of a stepped or grooved bar; for a flat bar its depth h is the narrower width; for a plate with a hole, h is the net width beside the hole. The fits reproduce the published charts to within a few percent inside their ranges; outside them the factor is refused."</p>
                </div>
            })
        }}
    }
}

/// The factors the shape's fits give, with where they came from.
#[component]
pub fn FittedFactors(
    form: RwSignal<CaseForm>,
    shown: Memo<Option<Evaluation>>,
    stale: Memo<bool>,
) -> impl IntoView {
    let choices = SharedCase::of(form).choices;
    let on = Memo::new(move |_| choices.with(|c| c.kt_from != KtFrom::Typed));
    let fitted = Memo::new(move |_| {
        shown.with(|e| match e.as_ref().and_then(|e| e.outcome.as_ref()) {
            Some(Outcome::Section(s)) => s.shape.clone(),
            _ => None,
        })
    });
    move || {
        on.get().then(|| {
            view! {
                <div class="notch-fit" id="notch-fit" class:stale=move || stale.get()>
                    <h4>"Factors from the fits"<StaleBadge stale=stale/></h4>
                    {move || fitted.with(|f| f.as_deref().map(factors_view))}
                </div>
            }
        })
    }
}
