//! "Many points": a table of stress states, gauge readings or strains (an FE export, a logger
//! file) read into the case's terms. Each row goes through the case's own path and material;
//! the worst rows are listed first, the ranking measure is drawn against the line (or time)
//! and as a histogram, and any listed row opens as the case. The table itself stays in this
//! browser tab: it is not in the case link.
//!
//! Large tables never block the page: a file is read as it streams in and the rows are computed in
//! chunks, and between them the browser paints the progress bar and takes input.

mod column_kinds;
mod history_pick;
mod pictures;
mod reading;
mod worst_rows;

pub use reading::MAX_TABLE_FILE;

use crate::edge::browser;
use crate::formats::table::write_results;
use crate::model::case::{Case, CaseForm, Mode};
use crate::model::evaluation::Evaluation;
use crate::model::table::{evaluate_rows, TableOutcome};
use column_kinds::ColumnKinds;
use history_pick::HistoryPick;
use leptos::prelude::*;
use leptos::task::spawn_local;
use pictures::{limit_of, MeasureHistogram, MeasureTrace};
use reading::{load, load_file, Loaded};
use std::sync::Arc;
use stresscase_core::points::{worst_few, Measure};
use stresscase_core::StressUnit;
use worst_rows::{default_rank, measure_name, measure_token, WorstRows, TOP};

/// Refusals listed with their details.
const LISTED_REFUSALS: usize = 10;

/// Rows computed between two hand-backs to the browser.
const CHUNK: usize = 50_000;

/// The computed rows, or why the table cannot be computed; `None` while there is nothing to
/// show (no table, the case has a problem, or the rows are being computed).
pub type Outcome = Option<Result<Arc<TableOutcome>, String>>;

/// Long work under way, with the fraction done.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Busy {
    Reading(f64),
    Computing(f64),
}

/// The panel.
#[component]
pub fn TableView(form: RwSignal<CaseForm>, shown: Memo<Option<Evaluation>>) -> impl IntoView {
    let loaded: RwSignal<Option<Loaded>> = RwSignal::new(None);
    let problem = RwSignal::new(None::<String>);
    let unit = RwSignal::new(StressUnit::MPa);
    let rank = RwSignal::new(None::<Measure>);
    let paste = RwSignal::new(String::new());
    let file_input: NodeRef<leptos::html::Input> = NodeRef::new();
    let busy = RwSignal::new(None::<Busy>);
    let cancel = RwSignal::new(false);
    let outcome: RwSignal<Outcome> = RwSignal::new(None);
    // Bumped by every new computation and by a cancel: a chunked job that sees another number
    // stops.
    let job = StoredValue::new(0u64);

    let take = move |result: Result<Loaded, String>| match result {
        Ok(l) => {
            problem.set(None);
            rank.set(None);
            loaded.set(Some(l));
        }
        Err(e) => problem.set(Some(format!("Nothing was changed: {e}."))),
    };
    let on_file = move |_| {
        let Some(input) = file_input.get_untracked() else {
            return;
        };
        let Some((file, name, size)) = browser::chosen_file(&input) else {
            return;
        };
        browser::mark("table:chosen");
        cancel.set(false);
        busy.set(Some(Busy::Reading(0.0)));
        spawn_local(async move {
            let result = load_file(
                file,
                name,
                size,
                move |f| busy.set(Some(Busy::Reading(f))),
                move || cancel.get_untracked(),
            )
            .await;
            busy.set(None);
            browser::mark("table:read");
            match result {
                Ok(Some(l)) => take(Ok(l)),
                Ok(None) => problem.set(Some("Reading was cancelled; nothing was changed.".into())),
                Err(e) => take(Err(e)),
            }
        });
    };
    let on_paste = move |_| take(paste.with_untracked(|t| load(t, "pasted text".into())));

    // What of the case the rows depend on: its choices, numbers and units — not the typed
    // components, the turn, the probe's normal, the title or the note, so typing those does not
    // recompute every row.
    // Nor the fatigue check and the life, which the rows' measures do not use (taking a
    // history from the rows turns them on).
    let case_key = Memo::new(move |_| {
        form.with(|f| {
            let mut f = f.clone();
            f.choices = f.choices.without_fatigue();
            Case::from_form(&f).ok()
        })
        .map(|mut c| {
            c.title.clear();
            c.note.clear();
            c.stress = [0.0; 6];
            c.angle = 0.0;
            c.normal = [1.0; 3];
            c.mode = Mode::Plane;
            c
        })
    });
    // Recomputed when the table, its kinds or unit, or what the rows depend on changes: at
    // once for a small table, else a chunk at a time.
    Effect::new(move |_| {
        let l = loaded.get();
        let case = case_key.get();
        let unit = unit.get();
        job.update_value(|j| *j += 1);
        let me = job.get_value();
        let judgement = shown.with_untracked(|e| e.as_ref().map(|e| e.judgement.clone()));
        outcome.set(None);
        let (Some(l), Some(case), Some(judgement)) = (l, case, judgement) else {
            return;
        };
        let rows = l.table.rows();
        let columns = l.table.columns;
        let step = move |out: &mut TableOutcome, range: core::ops::Range<usize>| {
            evaluate_rows(
                &l.table.values,
                columns,
                &l.kinds,
                unit,
                (&case, &judgement),
                range,
                out,
            )
        };
        if rows <= CHUNK {
            let mut out = TableOutcome::with_room(rows);
            let r = step(&mut out, 0..rows);
            outcome.set(Some(r.map(|()| Arc::new(out)).map_err(|p| p.0)));
            return;
        }
        busy.set(Some(Busy::Computing(0.0)));
        spawn_local(async move {
            let mut out = TableOutcome::with_room(rows);
            let mut at = 0;
            while at < rows {
                let end = (at + CHUNK).min(rows);
                if let Err(p) = step(&mut out, at..end) {
                    if job.try_get_value() == Some(me) {
                        busy.set(None);
                        outcome.set(Some(Err(p.0)));
                    }
                    return;
                }
                at = end;
                if at < rows {
                    busy.set(Some(Busy::Computing(at as f64 / rows as f64)));
                    browser::yield_to_browser().await;
                    if job.try_get_value() != Some(me) {
                        return;
                    }
                }
            }
            if job.try_get_value() == Some(me) {
                busy.set(None);
                outcome.set(Some(Ok(Arc::new(out))));
                browser::mark("table:computed");
            }
        });
    });
    let on_cancel = move |_| match busy.get_untracked() {
        Some(Busy::Reading(_)) => cancel.set(true),
        _ => {
            job.update_value(|j| *j += 1);
            busy.set(None);
            loaded.set(None);
            problem.set(Some(
                "Computing was cancelled; the table was cleared.".into(),
            ));
        }
    };

    let ranking = Signal::derive(move || {
        outcome.with(|o| match o {
            Some(Ok(o)) => Some(rank.get().unwrap_or_else(|| default_rank(o))),
            _ => None,
        })
    });
    // What the list and pictures take from the case, as memos: the whole form and evaluation
    // change at every keystroke, the case's unit and the allowable seldom, and the rows must
    // not be ranked and drawn again for nothing.
    let case_unit = Memo::new(move |_| form.with(|f| f.unit));
    let limit = limit_of(shown, ranking);

    let status = move || {
        if let Some(b) = busy.get() {
            let (words, f) = match b {
                Busy::Reading(f) => ("Reading the file", f),
                Busy::Computing(f) => ("Computing the rows", f),
            };
            return view! {
                <div id="table-status" class="table-reading" data-rows="0" data-refused="0" data-done="false">
                    <label>{format!("{words}: {:.0} %", 100.0 * f)}" "
                        <progress id="table-progress" max="1" value=f.to_string()></progress>
                    </label>" "
                    <button type="button" id="table-cancel" on:click=on_cancel>"Cancel"</button>
                </div>
            }
            .into_any();
        }
        let Some(l) = loaded.get() else {
            return view! {
                <p id="table-status" class="hint" data-rows="0" data-refused="0" data-done="false">
                    "No table read yet."
                </p>
            }
            .into_any();
        };
        let (computed, path_refused, error) = outcome.with(|o| match o {
            Some(Ok(o)) => (o.rows.len(), o.refused.len(), None),
            Some(Err(e)) => (0, 0, Some(e.clone())),
            None => (
                0,
                0,
                Some("the case on screen has a problem to fix first".into()),
            ),
        });
        let refused = l.table.refused_count + path_refused;
        let shape = format!(
            "{}-separated{}{}",
            l.shape.separator.name(),
            if l.shape.decimal_comma {
                ", decimal comma"
            } else {
                ""
            },
            if l.shape.header.is_some() {
                ", with a header line"
            } else {
                ", no header line"
            },
        );
        let text = match &error {
            None => format!(
                "{computed} {} computed, {refused} refused — {} ({shape}, {} {}).",
                if computed == 1 { "row" } else { "rows" },
                l.from,
                l.table.columns,
                if l.table.columns == 1 {
                    "column"
                } else {
                    "columns"
                },
            ),
            Some(e) => format!("{} read ({shape}); not computed: {e}.", l.from),
        };
        view! {
            <p id="table-status" class:problem=error.is_some() data-rows=computed.to_string()
                data-refused=refused.to_string() data-done=if error.is_none() { "true" } else { "false" }>
                {text}
            </p>
        }
        .into_any()
    };

    let refusals = move || {
        let l = loaded.get()?;
        let mut items: Vec<String> = l
            .table
            .refused
            .iter()
            .take(LISTED_REFUSALS)
            .map(|r| format!("line {}, column {}: {}", r.line, r.column, r.reason))
            .collect();
        let path_refused = outcome.with(|o| {
            let Some(Ok(o)) = o else { return 0 };
            for (i, why) in o.refused.iter().take(LISTED_REFUSALS) {
                items.push(format!("line {}: {why}", l.table.lines[*i]));
            }
            o.refused.len()
        });
        let total = l.table.refused_count + path_refused;
        (total > 0).then(|| {
            view! {
                <div class="table-refusals" id="table-refusals">
                    <p>{if total == 1 {
                        "1 row is refused and left out of every result below:".to_string()
                    } else {
                        format!("{total} rows are refused and left out of every result below. The first of them:")
                    }}</p>
                    <ul>{items.into_iter().map(|t| view! { <li>{t}</li> }).collect_view()}</ul>
                    <p class="hint">"Fix them in the file and read it again, or go on without them. "
                        <button type="button" id="table-clear" on:click=move |_| loaded.set(None)>"Stop: clear the table"</button>
                    </p>
                </div>
            }
        })
    };

    let export_status = RwSignal::new(String::new());
    // Saves every computed row (`worst` false) or the listed worst ones, with their measures.
    let export = move |worst: bool| {
        let Some(l) = loaded.get_untracked() else {
            return;
        };
        let Some(by) = ranking.get_untracked() else {
            export_status.set("Nothing computed to save yet.".into());
            return;
        };
        let u = form.with_untracked(|f| f.unit);
        let text = outcome.with_untracked(|o| match o {
            Some(Ok(o)) => {
                let order: Vec<usize> = if worst {
                    worst_few(&o.measures, by, TOP)
                } else {
                    (0..o.rows.len()).collect()
                };
                Some(write_results(
                    &l.table,
                    &l.names(),
                    o,
                    &order,
                    u.symbol(),
                    &l.from,
                ))
            }
            _ => None,
        });
        let Some(text) = text else { return };
        let name = if worst {
            "stresscase-worst-rows.csv"
        } else {
            "stresscase-all-rows.csv"
        };
        let r = browser::download_as(name, &text, "text/csv");
        export_status.set(
            r.err()
                .map(|e| format!("Not saved: {e}."))
                .unwrap_or_default(),
        );
    };

    view! {
        <section class="panel table-view" id="panel-table" aria-labelledby="table-heading">
            <h2 class="panel-title" id="table-heading" tabindex="-1">"Many points: a table"</h2>
            <p class="hint">"An FE export of node stresses, or a logger file of gauge readings or strains: comma, semicolon (decimal comma), tab or space separated, with or without a header line. Each row goes through the case's path (its rosette, Hooke's-law condition, material and criterion). The table stays in this browser tab: it is not in the case link; the link holds the case of the row you open."</p>
            <div class="buttons">
                <label class="unit-pick">"Read a file "
                    <input type="file" id="table-file" accept=".csv,.txt,.tsv,.dat,text/csv,text/plain" node_ref=file_input on:change=on_file/>
                </label>
            </div>
            <label class="table-paste">"or paste the table"
                <textarea id="table-paste" rows="3" prop:value=move || paste.get()
                    on:input:target=move |ev| paste.set(ev.target().value())></textarea>
            </label>
            <div class="buttons"><button type="button" id="table-read" on:click=on_paste>"Read the pasted table"</button></div>
            <p class="problem" id="table-problem" hidden=move || problem.with(Option::is_none)>{move || problem.get()}</p>
            {status}
            <ColumnKinds loaded=loaded/>
            <div class="buttons" hidden=move || loaded.with(Option::is_none)>
                <label class="unit-pick">"Stress columns in "
                    <select id="table-unit" prop:value=move || unit.get().symbol()
                        on:change:target=move |ev| if let Some(u) = StressUnit::from_symbol(&ev.target().value()) { unit.set(u); }>
                        {StressUnit::ALL.iter().map(|u| view! { <option value=u.symbol()>{u.symbol()}</option> }).collect_view()}
                    </select>
                </label>
                <label class="unit-pick">"Worst rows by "
                    <select id="table-rank" prop:value=move || ranking.get().map_or("n", measure_token)
                        on:change:target=move |ev| {
                            let v = ev.target().value();
                            rank.set(Measure::ALL.into_iter().find(|m| measure_token(*m) == v));
                        }>
                        {Measure::ALL.iter().map(|m| view! { <option value=measure_token(*m)>{measure_name(*m)}</option> }).collect_view()}
                    </select>
                </label>
            </div>
            {refusals}
            <WorstRows form=form shown=shown loaded=loaded outcome=outcome ranking=ranking unit=unit case_unit=case_unit/>
            <div class="table-pictures">
                <MeasureTrace case_unit=case_unit limit=limit loaded=loaded outcome=outcome ranking=ranking/>
                <MeasureHistogram case_unit=case_unit limit=limit outcome=outcome ranking=ranking/>
            </div>
            <HistoryPick form=form loaded=loaded outcome=outcome unit=unit/>
            <div class="buttons export-row" hidden=move || ranking.get().is_none()>
                <button type="button" id="table-export-all" on:click=move |_| export(false)>"Save all rows with their results as CSV"</button>
                <button type="button" id="table-export-worst" on:click=move |_| export(true)>"Save the worst rows as CSV"</button>
                <span class="status" role="status">{move || export_status.get()}</span>
            </div>
        </section>
    }
}
