//! The column kinds the reader guessed from the header, one choice per column, for the user to
//! correct.

use super::reading::Loaded;
use crate::model::table::ColumnKind;
use leptos::prelude::*;

/// Every kind a column can be given, with its token and words.
pub fn kind_options() -> Vec<(ColumnKind, String, String)> {
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

pub fn kind_token(k: ColumnKind) -> String {
    kind_options()
        .into_iter()
        .find(|(x, _, _)| *x == k)
        .map_or_else(|| "skip".into(), |(_, t, _)| t)
}

pub fn kind_of_token(t: &str) -> ColumnKind {
    kind_options()
        .into_iter()
        .find(|(_, x, _)| x == t)
        .map_or(ColumnKind::Skip, |(k, _, _)| k)
}

/// One choice per column (`table-kind-1`, ...), named by the column's header.
#[component]
pub fn ColumnKinds(loaded: RwSignal<Option<Loaded>>) -> impl IntoView {
    move || {
        let l = loaded.get()?;
        let options = kind_options();
        Some(view! {
            <div class="table-kinds component-grid">
                {l.names().into_iter().enumerate().map(|(j, name)| {
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
}
