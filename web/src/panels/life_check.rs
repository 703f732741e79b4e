//! "Life in cycles": the S–N line and a mean-stress correction, and the life of the fatigue
//! check's cycle or the damage of a load history — typed, or taken from the table of many
//! points, whose count (and critical-plane scan) is worked out here because the case does not
//! hold the table — by rainflow counting and Miner's rule, with the S–N diagram, the cycle
//! matrix and the damage in each range bin.

use crate::edge::browser;
use crate::model::case::{CaseForm, Field};
use crate::model::choices::tokens;
use crate::model::evaluation::Evaluation;
use crate::model::inputs::Place;
use crate::model::judge::{
    history_outcome, plane_outcome, HistoryOutcome, LifeOutcome, LifeResult, LineFrom,
    PLANE_STEP_DEG,
};
use crate::model::numfmt::{format_sig, RESULT_DIGITS};
use crate::model::table::history::{HistoryValues, TableHistory};
use crate::panels::choice_select::ChoiceSelect;
use crate::panels::export_buttons::ExportButtons;
use crate::panels::mohr_diagram::NarrowScreen;
use crate::panels::number_field::SourceFields;
use crate::panels::shared_case::SharedCase;
use crate::panels::stale_notice::StaleBadge;
use leptos::prelude::*;
use std::sync::Arc;
use stresscase_core::damage::HistoryLife;
use stresscase_core::mean_stress::Reversed;
use stresscase_core::rainflow::CycleMatrix;
use stresscase_core::sn_curve::{Life, LOW_CYCLE_END};
use stresscase_core::StressUnit;

mod pictures;

use pictures::{bin_bars, matrix_cells, sn_picture, BINS};

/// Shown when the life is of the table's history but none was chosen.
const NO_TABLE_HISTORY: &str = "no table history yet: read a table under “Many points” and choose its history there (the table is not in the case link)";

/// Words for a life in cycles.
fn life_words(life: &Life) -> String {
    match life {
        Life::Infinite => "infinite (at or below the endurance limit: no damage)".into(),
        Life::Cycles(n) => format!("{} cycles", format_sig(*n, 3)),
        Life::LowCycle => format!(
            "not given: the amplitude reaches the line's stress at {} cycles (low-cycle fatigue; a stress-life line does not apply)",
            format_sig(LOW_CYCLE_END, 1)
        ),
    }
}

/// Words for what a mean-stress correction made of a cycle.
fn reversed_words(r: &Reversed, unit: &str) -> String {
    match r {
        Reversed::Amplitude(a) => format!("{} {unit}", format_sig(*a, RESULT_DIGITS)),
        other => other.to_string(),
    }
}

/// One result row: a label and a value carrying `data-key` and the unrounded `data-value`.
fn row(key: &'static str, label: String, value: Option<f64>, text: String) -> AnyView {
    view! {
        <tr><th scope="row">{label}</th>
        <td class="num" data-key=key data-value=value.map(|v| format!("{v:e}")).unwrap_or_default()>{text}</td></tr>
    }
    .into_any()
}

/// The rows describing the line and the correction.
fn line_rows(l: &LifeOutcome, u: &str) -> Vec<AnyView> {
    let mut v = Vec::new();
    match l.from {
        LineFrom::Estimated { f } => v.push(row(
            "life_f",
            "f at 10³ cycles, estimated (Shigley: 0.9 below Sut = 490 MPa, else from σ′F = Sut + 345 MPa)".into(),
            Some(f),
            format!("{} (ratio)", format_sig(f, 4)),
        )),
        LineFrom::Fraction { f } => v.push(row(
            "life_f",
            "f at 10³ cycles, typed".into(),
            Some(f),
            format!("{} (ratio)", format_sig(f, 4)),
        )),
        LineFrom::Own { n_ref, s_ref, k } => v.push(row(
            "life_ref",
            format!("own curve N = Nref·(σar/Sref)^−k, Nref = {} cycles, k = {}", format_sig(n_ref, 4), format_sig(k, 4)),
            Some(s_ref),
            format!("Sref = {} {u}", format_sig(s_ref, RESULT_DIGITS)),
        )),
    }
    v.push(row(
        "life_a",
        "line σar = a·Nᵇ: coefficient a".into(),
        Some(l.line.a),
        format!("{} {u}", format_sig(l.line.a, RESULT_DIGITS)),
    ));
    v.push(row(
        "life_b",
        "exponent b".into(),
        Some(l.line.b),
        format!("{} (ratio)", format_sig(l.line.b, RESULT_DIGITS)),
    ));
    v.push(match l.line.endurance {
        Some(e) => row(
            "life_limit",
            "endurance limit of the line (no damage at or below)".into(),
            Some(e),
            format!("{} {u}", format_sig(e, RESULT_DIGITS)),
        ),
        None => row(
            "life_limit",
            "endurance limit of the line".into(),
            None,
            "none: the line goes on (every cycle does damage)".into(),
        ),
    });
    v.push(row(
        "life_top",
        format!(
            "line's amplitude at {} cycles (upper end)",
            format_sig(LOW_CYCLE_END, 1)
        ),
        Some(l.line.amplitude_at(LOW_CYCLE_END)),
        format!(
            "{} {u}",
            format_sig(l.line.amplitude_at(LOW_CYCLE_END), RESULT_DIGITS)
        ),
    ));
    v
}

/// The rows of a history's damage and life.
fn history_rows(h: &HistoryOutcome) -> Vec<AnyView> {
    let counted: f64 = h.cycles.iter().map(|c| c.count).sum();
    let m = &h.miner;
    let mut v = vec![
        row(
            "hist_points",
            "values in the history".into(),
            Some(h.points as f64),
            h.points.to_string(),
        ),
        row(
            "hist_turning",
            "turning points (peaks and valleys, first and last)".into(),
            Some(h.turning as f64),
            h.turning.to_string(),
        ),
        row(
            "hist_cycles",
            "cycles counted (half cycles as ½)".into(),
            Some(counted),
            format_sig(counted, 6),
        ),
        row(
            "hist_damage",
            "damage per history, Miner D = Σ n/N".into(),
            Some(m.total),
            format!("{} (ratio)", format_sig(m.total, 4)),
        ),
    ];
    let flag = |n: f64, what: &str| format!("{} {what}", format_sig(n, 6));
    if m.low_cycle > 0.0 {
        v.push(row(
            "hist_low_cycle",
            "cycles in low-cycle fatigue (no life from the line)".into(),
            Some(m.low_cycle),
            flag(m.low_cycle, "cycles"),
        ));
    }
    if m.beyond_strength > 0.0 {
        v.push(row(
            "hist_beyond",
            "cycles whose mean reaches the strength (failure)".into(),
            Some(m.beyond_strength),
            flag(m.beyond_strength, "cycles"),
        ));
    }
    v.push(match h.life {
        HistoryLife::Repeats(r) => row(
            "hist_repeats",
            "life: repeats of the history (1/D)".into(),
            Some(r),
            format!("{} repeats", format_sig(r, 3)),
        ),
        HistoryLife::Infinite => row(
            "hist_repeats",
            "life: repeats of the history".into(),
            None,
            "infinite: no cycle does damage".into(),
        ),
        HistoryLife::NotGiven => row(
            "hist_repeats",
            "life: repeats of the history".into(),
            None,
            "not given: some cycle is outside the S–N line (see above)".into(),
        ),
    });
    if let (Some(hours), HistoryLife::Repeats(r)) = (h.hours, h.life) {
        v.push(row(
            "hist_hours",
            format!("life in hours ({} h per history)", format_sig(hours, 4)),
            Some(r * hours),
            format!("{} h", format_sig(r * hours, 3)),
        ));
    }
    v
}

/// The panel.
#[component]
pub fn LifeCheck(
    form: RwSignal<CaseForm>,
    shown: Memo<Option<Evaluation>>,
    stale: Memo<bool>,
) -> impl IntoView {
    let choices = SharedCase::of(form).choices;
    let fatigue_on = Memo::new(move |_| choices.with(|c| c.fatigue));
    let narrow = use_context::<NarrowScreen>().map(|n| n.0);
    let width = move || {
        if narrow.is_some_and(|n| n.get()) {
            pictures::W_NARROW
        } else {
            pictures::W_WIDE
        }
    };
    let on = Memo::new(move |_| choices.with(|c| c.life_on()));
    let of_history = Memo::new(move |_| choices.with(|c| c.history_on()));
    let of_table = Memo::new(move |_| {
        form.with(|f| {
            f.choices.life_on() && f.choices.life_of == crate::model::choices::LifeOf::Table
        })
    });
    let strengths = Memo::new(move |_| choices.with(|c| c.life_strengths()));
    let data = Memo::new(move |_| {
        shown.with(|e| {
            e.as_ref()
                .and_then(|e| e.judgement.life.clone().map(|l| (l, e.unit)))
        })
    });
    // A history from the table is worked out here: the case does not hold the table.
    let table_history = use_context::<RwSignal<Option<Arc<TableHistory>>>>();
    let table_life = Memo::new(move |_| {
        data.with(|d| {
            let (l, _) = d.as_ref()?;
            let LifeResult::Table(hours) = l.result else {
                return None;
            };
            let Some(th) = table_history.and_then(|t| t.get()) else {
                return Some(Err(NO_TABLE_HISTORY.to_string()));
            };
            let hours = hours.or(th.seconds.map(|s| s / 3600.0));
            let line = (&l.line, l.mean_stress, l.sut);
            browser::mark("life:count");
            let out = Some(match &th.values {
                HistoryValues::Signal(v) => history_outcome(v, line, hours)
                    .map(|h| Arc::new((th.about.clone(), h, None)))
                    .map_err(|e| e.to_string()),
                HistoryValues::Planes(p) => plane_outcome(p, l, hours).map(|p| {
                    let plane = (p.theta, p.planes.len());
                    Arc::new((th.about.clone(), p.on_plane, Some(plane)))
                }),
            });
            browser::mark("life:counted");
            out
        })
    });
    // The history shown: the typed one, or the table's (with its source and, for the
    // critical plane, the governing plane's angle and the planes counted).
    let history = Memo::new(move |_| {
        data.with(|d| match d.as_ref().map(|(l, _)| &l.result) {
            Some(LifeResult::History(h)) => Some(Arc::new((String::new(), h.clone(), None))),
            Some(LifeResult::Table(_)) => table_life.get().and_then(Result::ok),
            _ => None,
        })
    });
    let rows = move || {
        data.with(|d| {
            d.as_ref().map(|(l, u)| {
                let u = u.symbol();
                let mut v = line_rows(l, u);
                v.push(row(
                    "life_correction",
                    "mean-stress correction".into(),
                    None,
                    l.mean_stress.name().into(),
                ));
                match &l.result {
                    LifeResult::Cycle(c) => {
                        v.push(row(
                            "life_sa",
                            "cycle: σa,eq (from the fatigue check)".into(),
                            Some(c.sa),
                            format!("{} {u}", format_sig(c.sa, RESULT_DIGITS)),
                        ));
                        v.push(row(
                            "life_sm",
                            "cycle: σm,eq (signed by I1)".into(),
                            Some(c.sm),
                            format!("{} {u}", format_sig(c.sm, RESULT_DIGITS)),
                        ));
                        let sar = match c.reversed {
                            Reversed::Amplitude(a) => Some(a),
                            _ => None,
                        };
                        v.push(row(
                            "life_sar",
                            "fully reversed equivalent σar".into(),
                            sar,
                            reversed_words(&c.reversed, u),
                        ));
                        let n = match c.life {
                            Some(Life::Cycles(n)) => Some(n),
                            _ => None,
                        };
                        let text = c
                            .life
                            .as_ref()
                            .map_or_else(|| "not given (see σar)".to_string(), life_words);
                        v.push(row("life_n", "life".into(), n, text));
                    }
                    LifeResult::History(h) => v.extend(history_rows(h)),
                    LifeResult::Table(_) => match table_life.get() {
                        Some(Ok(t)) => {
                            let (about, h, plane) = &*t;
                            v.push(row("hist_from", "history from the table (not in the case link)".into(), None, about.clone()));
                            if let Some((theta, planes)) = plane {
                                v.push(row("plane_theta", format!("governing plane: its normal from x towards y ({planes} planes, every {} °)", format_sig(PLANE_STEP_DEG, 2)), Some(theta.to_degrees()), format!("{} °", format_sig(theta.to_degrees(), 4))));
                            }
                            v.extend(history_rows(h));
                        }
                        Some(Err(e)) => v.push(row("hist_from", "history from the table".into(), None, e)),
                        None => {}
                    },
                }
                v.collect_view()
            })
        })
    };
    let sn = move || {
        data.with(|d| {
            d.as_ref().map(|(l, u)| {
                let h = history.get();
                let w = width();
                let p = sn_picture(l, h.as_deref().map(|(_, h, _)| h), w);
                let u = u.symbol();
                let tx = p.ticks_n.iter().map(|(x, t)| view! { <g class="tick"><line x1=*x x2=*x y1=p.frame.3 y2=p.frame.3 + 4.0/><text x=*x y=p.frame.3 + 15.0 text-anchor="middle">{t.clone()}</text></g> }).collect_view();
                let ty = p.ticks_s.iter().map(|(y, t)| view! { <g class="tick"><line x1=p.frame.0 - 4.0 x2=p.frame.0 y1=*y y2=*y/><text x=p.frame.0 - 6.0 y=y + 4.0 text-anchor="end">{t.clone()}</text></g> }).collect_view();
                view! {
                    <svg id="sn-svg" viewBox=format!("0 0 {w} {}", pictures::H) role="img"
                        aria-label="S–N diagram: fully reversed amplitude against cycles to failure, log-log"
                        data-points=p.points.to_string()>
                        <rect class="plot-bg" x=p.frame.0 y=p.frame.1 width=p.frame.2 - p.frame.0 height=p.frame.3 - p.frame.1/>
                        <rect class="low-cycle-zone" x=p.frame.0 y=p.frame.1 width=(p.low_cycle_x - p.frame.0).max(0.0) height=p.frame.3 - p.frame.1/>
                        {tx}{ty}
                        <polyline class="sn-line" points=p.line.clone()/>
                        {p.endurance.clone().map(|pts| view! { <polyline class="sn-endurance" points=pts/> })}
                        <path class="sn-points" d=p.marks.clone()/>
                        <text class="axis-label" x=p.frame.2 y=pictures::H - 6.0 text-anchor="end">"cycles to failure N (log)"</text>
                        <text class="axis-label" x=p.frame.0 + 4.0 y=p.frame.1 + 12.0>{format!("fully reversed amplitude σar ({u}, log)")}</text>
                        <text class="zone-label" x=p.frame.0 + 4.0 y=p.frame.3 - 6.0>"low-cycle"</text>
                    </svg>
                    <ul class="legend">
                        <li class="key sn">"S–N line"</li>
                        <li class="key limit">"endurance limit"</li>
                        <li class="key points">{if matches!(l.result, LifeResult::Cycle(_)) { "the cycle (at the right edge: no damage)" } else { "each counted cycle (at the right edge: no damage)" }}</li>
                    </ul>
                }
            })
        })
    };
    let matrix = move || {
        data.with(|d| {
            let (_, u) = d.as_ref()?;
            let held = history.get()?;
            let w = width();
            let h = &held.1;
            let counts = CycleMatrix::of(&h.cycles, BINS, BINS, |i| h.cycles[i].count);
            let damage = CycleMatrix::of(&h.cycles, BINS, 1, |i| h.miner.per_cycle[i]);
            let u = u.symbol();
            let total: f64 = counts.cells.iter().sum();
            let cells = matrix_cells(&counts, w).into_iter().map(|c| view! {
                <rect class="matrix-cell" x=c.x y=c.y width=c.w height=c.h fill-opacity=format!("{:.3}", c.shade)><title>{c.title}</title></rect>
            }).collect_view();
            let bars = bin_bars(&damage, w).into_iter().map(|b| view! {
                <rect class="damage-bar" x=b.x y=b.y width=b.w height=b.h><title>{b.title}</title></rect>
            }).collect_view();
            Some(view! {
                <figure class="life-plot">
                    <svg id="cycle-matrix-svg" viewBox=format!("0 0 {w} {}", pictures::H) role="img"
                        aria-label="cycle matrix: counted cycles by range and mean" data-total=format!("{total:e}")>
                        <rect class="plot-bg" x=pictures::LEFT y=pictures::TOP width=w - pictures::LEFT - pictures::RIGHT height=pictures::H - pictures::TOP - pictures::BOTTOM/>
                        {cells}
                        <text class="axis-label" x=w - pictures::RIGHT y=pictures::H - 6.0 text-anchor="end">{format!("mean → {} to {} {u}", format_sig(counts.mean_span.0, 4), format_sig(counts.mean_span.1, 4))}</text>
                        <text class="axis-label" x=pictures::LEFT y=pictures::H - 22.0>{format!("range ↑ 0 to {} {u}", format_sig(counts.range_max, 4))}</text>
                    </svg>
                    <figcaption>"Cycles counted in each range × mean bin (darker: more; hover for the count)."</figcaption>
                    <ExportButtons svg_id="cycle-matrix-svg" name="cycle-matrix"/>
                </figure>
                <figure class="life-plot">
                    <svg id="damage-bins-svg" viewBox=format!("0 0 {w} {}", pictures::H) role="img"
                        aria-label="damage in each range bin" data-total=format!("{:e}", h.miner.total)>
                        <rect class="plot-bg" x=pictures::LEFT y=pictures::TOP width=w - pictures::LEFT - pictures::RIGHT height=pictures::H - pictures::TOP - pictures::BOTTOM/>
                        {bars}
                        {(h.miner.total <= 0.0).then(|| view! {
                            <text class="zone-label" x=w / 2.0 y=pictures::H / 2.0 text-anchor="middle">"No cycle does damage: every one is at or below the endurance limit."</text>
                        })}
                        <text class="axis-label" x=w - pictures::RIGHT y=pictures::H - 6.0 text-anchor="end">{format!("range → 0 to {} {u}", format_sig(damage.range_max, 4))}</text>
                        <text class="axis-label" x=pictures::LEFT y=pictures::H - 22.0>"share of the damage D ↑"</text>
                    </svg>
                    <figcaption>"Share of the history's damage done by the cycles in each range bin (hover for the damage)."</figcaption>
                    <ExportButtons svg_id="damage-bins-svg" name="damage-bins"/>
                </figure>
            })
        })
    };
    let strength_select = move || {
        strengths.get().then(|| view! {
            <ChoiceSelect form=form id="life-strength-unit" label="strengths here in"
                options=StressUnit::ALL.iter().map(|u| (u.symbol(), u.symbol())).collect()
                get=|f| f.choices.strength_unit.symbol()
                set=|f, v| if let Some(u) = StressUnit::from_symbol(v) { f.change_strength_unit(u); }/>
        })
    };
    view! {
        <section class="panel life" id="panel-life">
            <h2>"Life in cycles"<StaleBadge stale=stale/></h2>
            <p class="hint" hidden=move || fatigue_on.get()>"Turn on the fatigue check above first: the life uses its cycle, its endurance limit and the material's Sut."</p>
            <label class="check" hidden=move || !fatigue_on.get()>
                <input type="checkbox" id="life-on" prop:checked=move || on.get()
                    on:change:target=move |ev| form.update(|f| f.choices.life = ev.target().checked())/>
                " work out the life in cycles (S–N line), of the fatigue cycle or of a load history"
            </label>
            <div class="verdict-grid" hidden=move || !on.get()>
                <div class="verdict-inputs">
                    <ChoiceSelect form=form id="life-of" label="Life of"
                        options=vec![("cycle", "the fatigue check's cycle, repeated"), ("history", "a load history typed or pasted below"), ("table", "the history chosen in the table of many points")]
                        get=|f| tokens::token(&tokens::LIFE_OF, f.choices.life_of)
                        set=|f, v| if let Some(x) = tokens::value(&tokens::LIFE_OF, v) { f.choices.life_of = x; }/>
                    <ChoiceSelect form=form id="sn-line" label="S–N line"
                        options=vec![("estimate", "through f·Sut at 10³ and Se at 10⁶ cycles, f estimated"), ("f", "through f·Sut at 10³ and Se at 10⁶ cycles, f typed"), ("own", "my own Basquin curve")]
                        get=|f| tokens::token(&tokens::SN_FROM, f.choices.sn)
                        set=|f, v| if let Some(x) = tokens::value(&tokens::SN_FROM, v) { f.choices.sn = x; }/>
                    <ChoiceSelect form=form id="mean-stress" label="Mean-stress correction"
                        options=vec![("goodman", "Goodman σa/(1 − σm/Sut)"), ("gerber", "Gerber σa/(1 − (σm/Sut)²)"), ("swt", "Smith–Watson–Topper √(σmax·σa)"), ("morrow", "Morrow σa/(1 − σm/σ′f)")]
                        get=|f| tokens::token(&tokens::MEAN_STRESS, f.choices.mean_stress)
                        set=|f, v| if let Some(x) = tokens::value(&tokens::MEAN_STRESS, v) { f.choices.mean_stress = x; }/>
                    {strength_select}
                    <SourceFields form=form place=Place::LifeLine/>
                    <div hidden=move || !of_history.get()>
                        <HistoryEntry form=form/>
                    </div>
                    <p class="hint" hidden=move || !of_table.get()>"The history comes from the table under “Many points” (choose it there, after the rows are computed). The table stays in this browser tab: it is not in the case link or the calc sheet's QR code. The duration, when left empty, is the table's time column span."</p>
                    <SourceFields form=form place=Place::LifeHistory/>
                    <table class="result-group life-results" id="life-table" class:stale=move || stale.get()><tbody>{rows}</tbody></table>
                    <p class="hint">{move || life_notes(of_history.get() || of_table.get(), of_table.get())}</p>
                </div>
                <figure class="fatigue-plot">{sn}<ExportButtons svg_id="sn-svg" name="sn-diagram"/></figure>
                {matrix}
            </div>
        </section>
    }
}

/// The method and its limits, as printed under the results.
fn life_notes(history: bool, table: bool) -> String {
    let common = "A compressive mean is taken as not helping (σar = σa; common practice); Smith–Watson–Topper with σmax ≤ 0 does no damage. Below 10³ cycles a stress-life line does not apply (low-cycle fatigue): no life is given. Lives are estimates with wide scatter: check them against test data for the part.";
    if !history {
        return format!("The cycle is the fatigue check's (von Mises σa,eq and σm,eq, the mean signed by I1). {common}");
    }
    let kept = if table {
        "A history from the table is in the case's stress unit and stays in this browser tab: it is not in the case link. The critical-plane count takes the normal stress on planes through the point whose normals lie in the x–y plane, every 2°, counts and damages each, and reports the plane with the most damage; it ignores the shear on each plane and the out-of-plane components, so it suits tensile (mode I) cracking at a free surface. Signed von Mises takes the sign of the principal stress of largest magnitude (common practice)."
    } else {
        "The typed history is in the case's stress unit and is kept in the case link."
    };
    format!("Rainflow counting per ASTM E1049-85 (2017) §5.4.4, three-point method: the history is reduced to its peaks and valleys (first and last points kept), counting starts at the first point, a range containing the starting point counts as a half cycle, and ranges left at the end count as half cycles. Each cycle's amplitude and mean go through the correction to σar, the S–N line gives its life N, and Miner's rule sums n/N; it ignores the order of the cycles. {kept} {common}")
}

/// The typed load history: a text area that validates as you type.
#[component]
fn HistoryEntry(form: RwSignal<CaseForm>) -> impl IntoView {
    let field = Field::History;
    let problem = Memo::new(move |_| form.with(|f| f.problem(field)));
    view! {
        <div class="field history-field" class:invalid=move || problem.with(Option::is_some)>
            <label for=field.id()>{move || format!("load history: stress at the point, in order ({})", form.with(|f| f.unit.symbol()))}</label>
            <textarea id=field.id() rows="4" spellcheck="false" aria-describedby="in-history-msg"
                aria-invalid=move || if problem.with(Option::is_some) { "true" } else { "false" }
                prop:value=move || form.with(|f| f.history.clone())
                on:input:target=move |ev| form.update(|f| f.set_text(field, ev.target().value()))></textarea>
            <span class="field-msg" id="in-history-msg">{move || problem.get().unwrap_or_default()}</span>
            <p class="hint">"Numbers separated by commas, spaces or line breaks; with semicolons, a comma is the decimal mark. Up to 5000 values: peaks and valleys are enough."</p>
        </div>
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::model::choices::LifeOf;

    #[test]
    fn the_demo_history_is_counted_and_damaged() {
        let mut f = CaseForm::demo();
        f.choices.fatigue = true;
        f.choices.life = true;
        f.choices.life_of = LifeOf::History;
        let e = f.evaluate().unwrap();
        let l = e.judgement.life.unwrap();
        let LifeResult::History(h) = &l.result else {
            panic!()
        };
        assert_eq!(h.points, 13);
        assert!(h.miner.total >= 0.0);
        let p = sn_picture(&l, Some(h), pictures::W_WIDE);
        assert_eq!(p.points, h.cycles.len());
    }
}
