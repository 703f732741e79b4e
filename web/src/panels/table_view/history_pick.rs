//! "Use as the load history": one signal from the computed rows — a column, a stress
//! component, the signed von Mises, or the in-plane states for the critical-plane count —
//! handed to "Life in cycles". The history stays in this tab; it is not in the case link.

use super::reading::Loaded;
use super::Outcome;
use crate::model::case::{Case, CaseForm};
use crate::model::choices::LifeOf;
use crate::model::table::history::{
    duration, table_history, HistoryFrom, TableHistory, COMPONENTS,
};
use leptos::prelude::*;
use std::sync::Arc;
use stresscase_core::StressUnit;

/// The choice's token.
fn token(f: HistoryFrom) -> String {
    match f {
        HistoryFrom::Column(j) => format!("c{j}"),
        HistoryFrom::Component(k) => format!("s{k}"),
        HistoryFrom::SignedVonMises => "svm".into(),
        HistoryFrom::CriticalPlane => "plane".into(),
    }
}

/// The choice a token names.
fn from_token(t: &str) -> Option<HistoryFrom> {
    match t {
        "svm" => Some(HistoryFrom::SignedVonMises),
        "plane" => Some(HistoryFrom::CriticalPlane),
        _ => {
            let (kind, n) = t.split_at(1);
            let n: usize = n.parse().ok()?;
            match kind {
                "c" => Some(HistoryFrom::Column(n)),
                "s" if n < 6 => Some(HistoryFrom::Component(u8::try_from(n).ok()?)),
                _ => None,
            }
        }
    }
}

/// The control.
#[component]
pub fn HistoryPick(
    form: RwSignal<CaseForm>,
    loaded: RwSignal<Option<Loaded>>,
    outcome: RwSignal<Outcome>,
    unit: RwSignal<StressUnit>,
) -> impl IntoView {
    let shared = use_context::<RwSignal<Option<Arc<TableHistory>>>>();
    let pick = RwSignal::new("svm".to_string());
    let status = RwSignal::new(String::new());
    // The history holds the rows as they were computed: when they are computed again (a new
    // table, its kinds or unit, or the case's path or material changed) it is dropped, never
    // left standing for rows that no longer exist.
    let generation = StoredValue::new(0u64);
    let taken_at = StoredValue::new(None::<u64>);
    Effect::new(move |_| {
        outcome.track();
        generation.update_value(|g| *g += 1);
        if taken_at
            .get_value()
            .is_some_and(|t| t != generation.get_value())
        {
            taken_at.set_value(None);
            if let Some(s) = shared {
                s.set(None);
            }
            status.set("The rows were computed again: take the history again.".into());
        }
    });
    let options = move || {
        let mut v: Vec<(String, String)> = vec![
            (
                token(HistoryFrom::SignedVonMises),
                "signed von Mises of each row".into(),
            ),
            (
                token(HistoryFrom::CriticalPlane),
                "critical plane: normal stress on planes every 2°".into(),
            ),
        ];
        v.extend((0u8..6).map(|k| {
            (
                token(HistoryFrom::Component(k)),
                format!("{} of each row", COMPONENTS[usize::from(k)]),
            )
        }));
        if let Some(l) = loaded.get() {
            v.extend(l.names().into_iter().enumerate().map(|(j, n)| {
                (
                    token(HistoryFrom::Column(j)),
                    format!("column “{n}”, read as stress"),
                )
            }));
        }
        v.into_iter()
            .map(|(value, text)| view! { <option value=value>{text}</option> })
            .collect_view()
    };
    let take = move |_| {
        let (Some(l), Some(shared)) = (loaded.get_untracked(), shared) else {
            return;
        };
        let Some(from) = from_token(&pick.get_untracked()) else {
            return;
        };
        let Some(case) = form.with_untracked(|f| Case::from_form(f).ok()) else {
            status.set("Not taken: the case on screen has a problem to fix first.".into());
            return;
        };
        let result = outcome.with_untracked(|o| match o {
            Some(Ok(o)) => table_history(
                (&l.table.values, l.table.columns),
                &l.kinds,
                unit.get_untracked(),
                &case,
                o,
                from,
            )
            .map(|values| TableHistory {
                about: format!("{}: {}", l.from, from.describe(&l.names())),
                values,
                seconds: duration(&l.table.values, l.table.columns, &l.kinds, o),
            }),
            _ => Err("the rows are not computed yet".into()),
        });
        match result {
            Ok(h) => {
                status.set(format!(
                    "{} rows taken as the load history: see “Life in cycles”.",
                    h.len()
                ));
                shared.set(Some(Arc::new(h)));
                taken_at.set_value(Some(generation.get_value()));
                form.update(|f| {
                    f.choices.fatigue = true;
                    f.choices.life = true;
                    f.choices.life_of = LifeOf::Table;
                });
            }
            Err(e) => status.set(format!("Not taken: {e}.")),
        }
    };
    view! {
        <div class="buttons" hidden=move || outcome.with(|o| !matches!(o, Some(Ok(_))))>
            <label class="unit-pick">"Load history from the rows "
                <select id="table-history-from" prop:value=move || pick.get()
                    on:change:target=move |ev| pick.set(ev.target().value())>
                    {options}
                </select>
            </label>
            <button type="button" id="table-use-history" on:click=take>"Use as the load history"</button>
            <span class="status" role="status" id="table-history-status">{move || status.get()}</span>
        </div>
    }
}
