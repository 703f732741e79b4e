//! "Many points": a table of stress states, gauge readings or strains (an FE export, a logger
//! file) read into the case's terms. Each row goes through the case's own path and material;
//! the worst rows are listed first and any of them opens as the case. The table itself stays
//! in this browser tab: it is not in the case link.

use crate::edge::browser;
use crate::formats::table::{guess_kinds, read, sniff, write_results, PieceReader, Shape, Table};
use crate::model::case::{Case, CaseForm, Field, Mode};
use crate::model::choices::Source;
use crate::model::evaluation::Evaluation;
use crate::model::inputs::Num;
use crate::model::numfmt::{format_for_entry, format_sig};
use crate::model::table::{evaluate, row_state, ColumnKind, RowState, TableOutcome};
use leptos::prelude::*;
use leptos::task::spawn_local;
use std::sync::Arc;
use stresscase_core::points::{worst_first, Measure};
use stresscase_core::StressUnit;

/// Largest table file the page reads, in bytes.
pub const MAX_TABLE_FILE: usize = 256 * 1024 * 1024;

/// Rows listed as the worst.
const TOP: usize = 10;

/// Refusals listed with their details.
const LISTED_REFUSALS: usize = 10;

/// A table read, with the kinds the user confirmed.
#[derive(Clone)]
struct Loaded {
    /// Where it came from (file name, or "pasted text").
    from: String,
    shape: Shape,
    table: Arc<Table>,
    kinds: Vec<ColumnKind>,
}

/// Every kind a column can be given, with its token and words.
fn kind_options() -> Vec<(ColumnKind, String, String)> {
    let mut v = vec![
        (ColumnKind::Skip, "skip".into(), "not used".into()),
        (ColumnKind::Label, "label".into(), "row id or label".into()),
        (ColumnKind::Time, "time".into(), "time".into()),
    ];
    for (k, n) in (0u8..).zip(["σx", "σy", "σz", "τxy", "τyz", "τzx"]) {
        v.push((
            ColumnKind::Stress(k),
            format!("s{k}"),
            format!("stress {n}"),
        ));
    }
    for g in 0..8u8 {
        v.push((
            ColumnKind::Gauge(g),
            format!("g{g}"),
            format!("gauge {} reading", g + 1),
        ));
    }
    for (k, n) in (0u8..).zip(["εx", "εy", "εz", "γxy", "γyz", "γzx"]) {
        v.push((
            ColumnKind::Strain(k),
            format!("e{k}"),
            format!("strain {n}"),
        ));
    }
    v
}

fn kind_token(k: ColumnKind) -> String {
    kind_options()
        .into_iter()
        .find(|(x, _, _)| *x == k)
        .map_or_else(|| "skip".into(), |(_, t, _)| t)
}

fn kind_of_token(t: &str) -> ColumnKind {
    kind_options()
        .into_iter()
        .find(|(_, x, _)| x == t)
        .map_or(ColumnKind::Skip, |(k, _, _)| k)
}

/// How a measure is named in the ranking choice and the list.
fn measure_name(m: Measure) -> &'static str {
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

fn measure_token(m: Measure) -> &'static str {
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
fn default_rank(out: &TableOutcome) -> Measure {
    if out.measures.iter().any(|m| m.factor.is_finite()) {
        Measure::Factor
    } else {
        Measure::VonMises
    }
}

/// Makes row `i` of the table the case on screen: its gauge readings in the rosette path, its
/// strains in the strain path, else its tensor as typed components; the row's label (or line)
/// in the title.
fn open_row(f: &mut CaseForm, l: &Loaded, out: &TableOutcome, k: usize, unit: StressUnit) {
    let i = out.rows[k];
    let row = l.table.row(i);
    let line = l.table.lines[i];
    let id = l
        .table
        .label(i)
        .map_or_else(|| format!("line {line}"), |s| format!("{s} (line {line})"));
    f.title = format!("{id} of {}", l.from);
    match row_state(&l.kinds, unit) {
        Ok(RowState::Rosette) => {
            f.choices.source = Source::Rosette;
            for (j, kind) in l.kinds.iter().enumerate() {
                if let ColumnKind::Gauge(g) = kind {
                    f.set_text(Field::Src(Num::gauge_reading(*g)), format_for_entry(row[j]));
                }
            }
        }
        Ok(RowState::Strain) => {
            const NUMS: [Num; 6] = [Num::Ex, Num::Ey, Num::Ez, Num::Gxy, Num::Gyz, Num::Gzx];
            f.choices.source = Source::Strain;
            for (j, kind) in l.kinds.iter().enumerate() {
                if let ColumnKind::Strain(s) = kind {
                    f.set_text(Field::Src(NUMS[usize::from(*s)]), format_for_entry(row[j]));
                }
            }
        }
        _ => {
            let t = out.tensors[k];
            f.choices.source = Source::Typed;
            f.mode = if t.is_plane() {
                Mode::Plane
            } else {
                Mode::Full
            };
            for (field, v) in Field::STRESS.into_iter().zip(t.components()) {
                f.set_text(field, format_for_entry(v));
            }
        }
    }
}

/// Reads `text` as a table, or says why not.
fn load(text: &str, from: String) -> Result<Loaded, String> {
    let shape = sniff(text).map_err(|e| e.to_string())?;
    let kinds = guess_kinds(&shape);
    let label = kinds.iter().position(|k| *k == ColumnKind::Label);
    let table = read(text, &shape, label);
    Ok(Loaded {
        from,
        shape,
        table: Arc::new(table),
        kinds,
    })
}

/// Bytes read between two hand-backs to the browser.
const PIECE: usize = 2 * 1024 * 1024;

/// [`load`], a piece at a time: between pieces the browser paints `progress` (0–1) and takes
/// input; `cancelled` is asked after each piece. `Ok(None)` when cancelled.
async fn load_in_pieces(
    text: String,
    from: String,
    progress: RwSignal<Option<f64>>,
    cancelled: impl Fn() -> bool,
) -> Result<Option<Loaded>, String> {
    let shape = sniff(&text).map_err(|e| e.to_string())?;
    let kinds = guess_kinds(&shape);
    let label = kinds.iter().position(|k| *k == ColumnKind::Label);
    let mut reader = PieceReader::new(&text, &shape, label, PIECE);
    let many = reader.pieces() > 1;
    while let Some(f) = reader.step() {
        if many {
            progress.set(Some(f));
            browser::yield_to_browser().await;
            if cancelled() {
                return Ok(None);
            }
        }
    }
    let table = reader.finish();
    Ok(Some(Loaded {
        from,
        shape,
        table: Arc::new(table),
        kinds,
    }))
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

    let take = move |result: Result<Loaded, String>| match result {
        Ok(l) => {
            problem.set(None);
            rank.set(None);
            loaded.set(Some(l));
        }
        Err(e) => problem.set(Some(format!("Nothing was changed: {e}."))),
    };
    let progress = RwSignal::new(None::<f64>);
    let cancel = RwSignal::new(false);
    let on_file = move |_| {
        let Some(input) = file_input.get_untracked() else {
            return;
        };
        let name = input
            .files()
            .and_then(|f| f.get(0))
            .map_or_else(|| "the file".into(), |f| f.name());
        cancel.set(false);
        progress.set(Some(0.0));
        spawn_local(async move {
            let read = browser::read_chosen_file(&input, MAX_TABLE_FILE, "table").await;
            let result = match read {
                Ok(text) => {
                    load_in_pieces(text, name, progress, move || cancel.get_untracked()).await
                }
                Err(e) => Err(e),
            };
            progress.set(None);
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
    let case_key = Memo::new(move |_| {
        form.with(|f| Case::from_form(f).ok()).map(|mut c| {
            c.title.clear();
            c.note.clear();
            c.stress = [0.0; 6];
            c.angle = 0.0;
            c.normal = [1.0; 3];
            c.mode = Mode::Plane;
            c
        })
    });
    // Recomputed when the table, its kinds or unit, or what the rows depend on changes.
    let outcome = Memo::new(move |_| {
        let l = loaded.get()?;
        let case = case_key.get()?;
        let unit = unit.get();
        shown.with_untracked(|e| {
            let e = e.as_ref()?;
            Some(
                evaluate(
                    &l.table.values,
                    l.table.columns,
                    &l.kinds,
                    unit,
                    &case,
                    &e.judgement,
                )
                .map(Arc::new)
                .map_err(|p| p.0),
            )
        })
    });
    let ranking = move || {
        outcome.with(|o| match o {
            Some(Ok(o)) => Some(rank.get().unwrap_or_else(|| default_rank(o))),
            _ => None,
        })
    };

    let status = move || {
        if let Some(f) = progress.get() {
            return view! {
                <div id="table-status" class="table-reading" data-rows="0" data-refused="0" data-done="false">
                    <label>{format!("Reading the file: {:.0} %", 100.0 * f)}" "
                        <progress id="table-progress" max="1" value=f.to_string()></progress>
                    </label>" "
                    <button type="button" id="table-cancel" on:click=move |_| cancel.set(true)>"Cancel"</button>
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
        outcome.with(|o| {
            if let Some(Ok(o)) = o {
                for (i, why) in o.refused.iter().take(LISTED_REFUSALS) {
                    items.push(format!("line {}: {why}", l.table.lines[*i]));
                }
            }
        });
        let total = l.table.refused_count
            + outcome.with(|o| {
                o.as_ref()
                    .and_then(|o| o.as_ref().ok())
                    .map_or(0, |o| o.refused.len())
            });
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

    let kinds = move || {
        let l = loaded.get()?;
        let names: Vec<String> = l.shape.header.clone().unwrap_or_else(|| {
            (1..=l.table.columns)
                .map(|j| format!("column {j}"))
                .collect()
        });
        let options = kind_options();
        Some(view! {
            <div class="table-kinds component-grid">
                {names.into_iter().enumerate().map(|(j, name)| {
                    let id = format!("table-kind-{}", j + 1);
                    let current = kind_token(l.kinds.get(j).copied().unwrap_or(ColumnKind::Skip));
                    let options = options.clone();
                    view! {
                        <label class="unit-pick">{name}" "
                            <select id=id prop:value=current
                                on:change:target=move |ev| {
                                    let k = kind_of_token(&ev.target().value());
                                    loaded.update(|l| if let Some(l) = l {
                                        if let Some(slot) = l.kinds.get_mut(j) { *slot = k; }
                                    });
                                }>
                                {options.into_iter().map(|(_, t, words)| view! { <option value=t>{words}</option> }).collect_view()}
                            </select>
                        </label>
                    }
                }).collect_view()}
            </div>
        })
    };

    let top = move || {
        let by = ranking()?;
        let l = loaded.get()?;
        let u = form.with(|f| f.unit);
        outcome.with(|o| {
            let Some(Ok(o)) = o else { return None };
            let order = worst_first(&o.measures, by);
            // The label column's own name ("node", "point", ...), as the file has it.
            let label_name = l
                .kinds
                .iter()
                .position(|k| *k == ColumnKind::Label)
                .and_then(|j| l.shape.header.as_ref()?.get(j).cloned())
                .unwrap_or_else(|| "id".into());
            let items = order
                .into_iter()
                .take(TOP)
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
    };

    let export_status = RwSignal::new(String::new());
    // Saves every computed row (`worst` false) or the listed worst ones, with their measures.
    let export = move |worst: bool| {
        let Some(l) = loaded.get_untracked() else {
            return;
        };
        let Some(by) = ranking() else {
            export_status.set("Nothing computed to save yet.".into());
            return;
        };
        let u = form.with_untracked(|f| f.unit);
        let names: Vec<String> = l.shape.header.clone().unwrap_or_else(|| {
            (1..=l.table.columns)
                .map(|j| format!("column {j}"))
                .collect()
        });
        let text = outcome.with_untracked(|o| match o {
            Some(Ok(o)) => {
                let order: Vec<usize> = if worst {
                    worst_first(&o.measures, by).into_iter().take(TOP).collect()
                } else {
                    (0..o.rows.len()).collect()
                };
                Some(write_results(
                    &l.table,
                    &names,
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
            {kinds}
            <div class="buttons" hidden=move || loaded.with(Option::is_none)>
                <label class="unit-pick">"Stress columns in "
                    <select id="table-unit" prop:value=move || unit.get().symbol()
                        on:change:target=move |ev| if let Some(u) = StressUnit::from_symbol(&ev.target().value()) { unit.set(u); }>
                        {StressUnit::ALL.iter().map(|u| view! { <option value=u.symbol()>{u.symbol()}</option> }).collect_view()}
                    </select>
                </label>
                <label class="unit-pick">"Worst rows by "
                    <select id="table-rank" prop:value=move || ranking().map_or("n", measure_token)
                        on:change:target=move |ev| {
                            let v = ev.target().value();
                            rank.set(Measure::ALL.into_iter().find(|m| measure_token(*m) == v));
                        }>
                        {Measure::ALL.iter().map(|m| view! { <option value=measure_token(*m)>{measure_name(*m)}</option> }).collect_view()}
                    </select>
                </label>
            </div>
            {refusals}
            {top}
            <div class="buttons export-row" hidden=move || ranking().is_none()>
                <button type="button" id="table-export-all" on:click=move |_| export(false)>"Save all rows with their results as CSV"</button>
                <button type="button" id="table-export-worst" on:click=move |_| export(true)>"Save the worst rows as CSV"</button>
                <span class="status" role="status">{move || export_status.get()}</span>
            </div>
        </section>
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn every_kind_has_one_token() {
        for (k, t, _) in kind_options() {
            assert_eq!(kind_of_token(&t), k);
            assert_eq!(kind_token(k), t);
        }
    }

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
        assert_eq!(opened.tensor, out.tensors[worst]);
        assert_eq!(f.title, "8 (line 3) of t.csv");
    }
}
