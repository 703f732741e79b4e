//! The worst rows of the table by the chosen measure, each with a button that opens it as the
//! case on screen.

use super::reading::Loaded;
use super::Outcome;
use crate::model::case::{Case, CaseForm, Field, Mode};
use crate::model::choices::Source;
use crate::model::evaluation::Evaluation;
use crate::model::inputs::Num;
use crate::model::numfmt::{format_for_entry, format_sig};
use crate::model::table::{row_state, row_tensor, ColumnKind, RowState, TableOutcome};
use leptos::prelude::*;
use std::sync::Arc;
use stresscase_core::points::{worst_few, Measure};
use stresscase_core::StressUnit;

/// Rows listed as the worst (and saved as "the worst rows").
pub const TOP: usize = 10;

/// How a measure is named in the ranking choice and the list.
pub fn measure_name(m: Measure) -> &'static str {
    match m {
        Measure::Factor => "static factor of safety (lowest first)",
        Measure::VonMises => "von Mises (highest first)",
        Measure::Sigma1 => "σ1 (highest first)",
        Measure::Sigma2 => "σ2 (highest first)",
        Measure::Sigma3 => "σ3 (most compressive first)",
        Measure::TauMax => "τmax (highest first)",
        Measure::Tresca => "Tresca intensity (highest first)",
        Measure::Triaxiality => "triaxiality (highest first)",
    }
}

/// A measure's short symbol, for axes.
pub fn measure_symbol(m: Measure) -> &'static str {
    match m {
        Measure::Factor => "n",
        Measure::VonMises => "σvm",
        Measure::Sigma1 => "σ1",
        Measure::Sigma2 => "σ2",
        Measure::Sigma3 => "σ3",
        Measure::TauMax => "τmax",
        Measure::Tresca => "σ1 − σ3",
        Measure::Triaxiality => "σm/σvm",
    }
}

/// Whether a measure is a stress (has the case's unit).
pub fn is_stress(m: Measure) -> bool {
    !matches!(m, Measure::Factor | Measure::Triaxiality)
}

pub fn measure_token(m: Measure) -> &'static str {
    match m {
        Measure::Factor => "n",
        Measure::VonMises => "vm",
        Measure::Sigma1 => "s1",
        Measure::Sigma2 => "s2",
        Measure::Sigma3 => "s3",
        Measure::TauMax => "taumax",
        Measure::Tresca => "tresca",
        Measure::Triaxiality => "triax",
    }
}

/// The default ranking: the lowest factor of safety when any row has one, else von Mises.
pub fn default_rank(out: &TableOutcome) -> Measure {
    if out.measures.iter().any(|m| m.factor.is_finite()) {
        Measure::Factor
    } else {
        Measure::VonMises
    }
}

/// Makes row `k` of the outcome the case on screen: its gauge readings in the rosette path,
/// its strains in the strain path, else its tensor as typed components; the row's label (or
/// line) in the title.
pub fn open_row(f: &mut CaseForm, l: &Loaded, out: &TableOutcome, k: usize, unit: StressUnit) {
    let i = out.rows[k];
    let row = l.table.row(i);
    let line = l.table.lines[i];
    let state = row_state(&l.kinds, unit);
    // A typed row goes through the case's path again (the results keep only the measures);
    // the case on screen produced the listed rows, so this cannot fail unless it changed.
    let typed = match state {
        Ok(RowState::Rosette | RowState::Strain) => None,
        _ => {
            let Some(t) = Case::from_form(f)
                .ok()
                .and_then(|case| row_tensor(row, &l.kinds, unit, &case).ok())
            else {
                return;
            };
            Some(t)
        }
    };
    let id = l
        .table
        .label(i)
        .map_or_else(|| format!("line {line}"), |s| format!("{s} (line {line})"));
    f.title = format!("{id} of {}", l.from);
    if let Some(t) = typed {
        f.choices.source = Source::Typed;
        f.mode = if t.is_plane() {
            Mode::Plane
        } else {
            Mode::Full
        };
        for (field, v) in Field::STRESS.into_iter().zip(t.components()) {
            f.set_text(field, format_for_entry(v));
        }
        return;
    }
    if state == Ok(RowState::Rosette) {
        f.choices.source = Source::Rosette;
        for (j, kind) in l.kinds.iter().enumerate() {
            if let ColumnKind::Gauge(g) = kind {
                f.set_text(Field::Src(Num::gauge_reading(*g)), format_for_entry(row[j]));
            }
        }
    } else {
        const NUMS: [Num; 6] = [Num::Ex, Num::Ey, Num::Ez, Num::Gxy, Num::Gyz, Num::Gzx];
        f.choices.source = Source::Strain;
        for (j, kind) in l.kinds.iter().enumerate() {
            if let ColumnKind::Strain(s) = kind {
                f.set_text(Field::Src(NUMS[usize::from(*s)]), format_for_entry(row[j]));
            }
        }
    }
}

/// The list (`table-top`): each row's line, label, n, von Mises and σ1, and its open button.
#[component]
pub fn WorstRows(
    form: RwSignal<CaseForm>,
    shown: Memo<Option<Evaluation>>,
    loaded: RwSignal<Option<Loaded>>,
    outcome: RwSignal<Outcome>,
    ranking: Signal<Option<Measure>>,
    unit: RwSignal<StressUnit>,
    case_unit: Memo<StressUnit>,
) -> impl IntoView {
    move || {
        let by = ranking.get()?;
        let l = loaded.get()?;
        let u = case_unit.get();
        outcome.with(|o| {
            let Some(Ok(o)) = o else { return None };
            let order = worst_few(&o.measures, by, TOP);
            // The label column's own name ("node", "point", ...), as the file has it.
            let label_name = l
                .kinds
                .iter()
                .position(|k| *k == ColumnKind::Label)
                .and_then(|j| l.shape.header.as_ref()?.get(j).cloned())
                .unwrap_or_else(|| "id".into());
            let items = order
                .into_iter()
                .enumerate()
                .map(|(rank_no, k)| {
                    let i = o.rows[k];
                    let m = &o.measures[k];
                    let value = by.of(m);
                    let line = l.table.lines[i];
                    let id = l
                        .table
                        .label(i)
                        .map(|s| format!(", {label_name} {s}"))
                        .unwrap_or_default();
                    let text = format!(
                        "line {line}{id}: n = {}, σvm = {} {}, σ1 = {} {}",
                        format_sig(m.factor, 3),
                        format_sig(m.von_mises, 4),
                        u.symbol(),
                        format_sig(m.principal[0], 4),
                        u.symbol()
                    );
                    let l2 = l.clone();
                    let o2 = Arc::clone(o);
                    view! {
                        <li data-row=line.to_string() data-value=value.to_string()>
                            {text}" "
                            <button type="button" id=format!("table-open-{}", rank_no + 1)
                                on:click=move |_| form.update(|f| open_row(f, &l2, &o2, k, unit.get_untracked()))>
                                "Open as the case"
                            </button>
                        </li>
                    }
                })
                .collect_view();
            let basis = shown.with_untracked(|e| {
                e.as_ref().map(|e| {
                    format!(
                        "Worst rows by {}. n is the static factor of safety by {} for {} (the case's material and criterion in use); stresses in {}, in the case's axes.",
                        measure_name(by),
                        e.judgement.in_use.name(),
                        e.judgement.name,
                        u.symbol()
                    )
                })
            });
            Some(view! {
                <p class="hint" id="table-basis">{basis}</p>
                <ol id="table-top" class="table-top">{items}</ol>
            })
        })
    }
}

#[cfg(test)]
mod tests {
    use super::super::reading::load;
    use super::*;
    use crate::model::table::evaluate;
    use stresscase_core::points::worst_first;
    use stresscase_core::StressTensor;

    #[test]
    fn an_opened_row_is_the_case_on_screen() {
        let mut f = CaseForm::demo();
        let l = load("node,sx,sy,txy\n7,84,-22,37\n8,300,0,0\n", "t.csv".into()).unwrap();
        let case = Case::from_form(&f).unwrap();
        let e = case.evaluate().unwrap();
        let out = evaluate(
            &l.table.values,
            4,
            &l.kinds,
            StressUnit::MPa,
            &case,
            &e.judgement,
        )
        .unwrap();
        let worst = worst_first(&out.measures, default_rank(&out))[0];
        assert_eq!(l.table.lines[out.rows[worst]], 3);
        open_row(&mut f, &l, &out, worst, StressUnit::MPa);
        let opened = f.evaluate().unwrap();
        let row = l.table.row(out.rows[worst]);
        assert_eq!(row[1..], [300.0, 0.0, 0.0]); // the label column reads as NaN
        assert_eq!(opened.tensor, StressTensor::plane(300.0, 0.0, 0.0).unwrap());
        assert_eq!(f.title, "8 (line 3) of t.csv");
    }
}
