//! "Keep and share": the case's title and note, its link (copy to share), and the list of saved
//! cases with open, rename, duplicate, delete, export to a file and import from one.

use crate::edge::browser::{self, LIBRARY_KEY};
use crate::formats::link::Case;
use crate::formats::saved::Library;
use crate::model::case::{CaseForm, Field};
use crate::panels::shared_case::SharedCase;
use leptos::html;
use leptos::prelude::*;
use leptos::task::spawn_local;

/// Reads the saved cases kept in this browser. Unreadable data is set aside under another key
/// (never overwritten) and reported.
fn load_library(problem: RwSignal<Option<String>>) -> Library {
    match browser::load(LIBRARY_KEY) {
        Ok(None) => Library::default(),
        Ok(Some(text)) => Library::from_json(&text).unwrap_or_else(|e| {
            let aside = format!("{LIBRARY_KEY}.unreadable");
            let _ = browser::store(&aside, &text);
            problem.set(Some(format!("the saved cases in this browser could not be read ({e}); they were set aside under '{aside}'")));
            Library::default()
        }),
        Err(e) => {
            problem.set(Some(e));
            Library::default()
        }
    }
}

/// The panel.
#[component]
pub fn CaseShelf(
    form: RwSignal<CaseForm>,
    storage_problem: RwSignal<Option<String>>,
) -> impl IntoView {
    let library = RwSignal::new(load_library(storage_problem));
    let status = RwSignal::new(String::new());
    let save_name = RwSignal::new(String::new());
    let link = SharedCase::of(form).link;
    let persist = move || {
        let text = library.with(Library::to_json);
        match browser::store(LIBRARY_KEY, &text) {
            Ok(()) => {}
            Err(e) => storage_problem.set(Some(e)),
        }
    };
    let copy = move |_| {
        let Some(url) = link.get_untracked() else {
            status.set("Fix the marked inputs first: only a valid case has a link.".into());
            return;
        };
        spawn_local(async move {
            match browser::copy(&url).await {
                Ok(()) => status.set("Link copied.".into()),
                Err(e) => status.set(format!(
                    "Could not copy ({e}); select the link and copy it by hand."
                )),
            }
        });
    };
    let save = move |_| {
        let name = save_name.get_untracked();
        match form.with_untracked(Case::from_form) {
            Ok(case) => {
                let name = if name.trim().is_empty() {
                    case.title.chars().take(60).collect()
                } else {
                    name
                };
                let result = library
                    .try_update(|l| l.save(&name, &case))
                    .unwrap_or(Ok(0));
                match result {
                    Ok(_) => {
                        status.set(format!("Saved as '{}'.", name.trim()));
                        persist();
                    }
                    Err(e) => status.set(format!("Not saved: {e}.")),
                }
            }
            Err(_) => status.set("Not saved: fix the marked inputs first.".into()),
        }
    };
    let export = move |_| {
        let text = library.with_untracked(Library::to_json);
        match browser::download("stresscase-cases.json", &text) {
            Ok(()) => status.set(format!(
                "Exported {} cases.",
                library.with_untracked(|l| l.entries().len())
            )),
            Err(e) => status.set(format!("Export failed: {e}.")),
        }
    };
    let import = move |input: web_sys::HtmlInputElement| {
        spawn_local(async move {
            let read =
                browser::read_chosen_file(&input, crate::formats::saved::MAX_FILE, "saved cases")
                    .await;
            let parsed = read.and_then(|t| Library::from_json(&t).map_err(|e| e.to_string()));
            match parsed {
                Ok(other) => match library.try_update(|l| l.merge(other)).unwrap_or(Ok(0)) {
                    Ok(n) => {
                        status.set(format!("Imported {n} cases."));
                        persist();
                    }
                    Err(e) => status.set(format!("Import refused: {e}. Nothing was changed.")),
                },
                Err(e) => status.set(format!(
                    "Import refused: {}. Nothing was changed.",
                    e.trim_end_matches('.')
                )),
            }
            input.set_value("");
        });
    };
    let rows = move || {
        library.with(|l| {
            l.entries()
                .iter()
                .enumerate()
                .map(|(i, e)| {
                    let name_input = NodeRef::<html::Input>::new();
                    let open = move |_| match library.with_untracked(|l| l.case(i)) {
                        Ok(c) => {
                            form.set(c.to_form());
                            status.set(format!("Opened '{}'.", library.with_untracked(|l| l.entries()[i].name.clone())));
                        }
                        Err(e) => status.set(e.to_string()),
                    };
                    let rename = move |_| {
                        let new = name_input.get().map(|el| el.value()).unwrap_or_default();
                        match library.try_update(|l| l.rename(i, &new)).unwrap_or(Ok(())) {
                            Ok(()) => {
                                status.set(format!("Renamed to '{}'.", new.trim()));
                                persist();
                            }
                            Err(e) => status.set(format!("Not renamed: {e}.")),
                        }
                    };
                    let duplicate = move |_| match library.try_update(|l| l.duplicate(i)).unwrap_or(Ok(0)) {
                        Ok(_) => {
                            status.set("Duplicated.".into());
                            persist();
                        }
                        Err(e) => status.set(format!("Not duplicated: {e}.")),
                    };
                    let delete = move |_| {
                        if let Some(Ok(gone)) = library.try_update(|l| l.delete(i)) {
                            status.set(format!("Deleted '{}'.", gone.name));
                            persist();
                        }
                    };
                    view! {
                        <li class="saved-row" data-index=i>
                            <input type="text" class="saved-name" id=format!("saved-name-{i}") node_ref=name_input
                                value=e.name.clone() aria-label="Name of the saved case" maxlength="100"/>
                            <button type="button" id=format!("saved-open-{i}") on:click=open>"Open"</button>
                            <button type="button" id=format!("saved-rename-{i}") on:click=rename>"Rename"</button>
                            <button type="button" id=format!("saved-dup-{i}") on:click=duplicate>"Duplicate"</button>
                            <button type="button" id=format!("saved-del-{i}") on:click=delete>"Delete"</button>
                        </li>
                    }
                })
                .collect_view()
        })
    };
    let text_problem =
        move |field: Field| move || form.with(|f| f.problem(field)).unwrap_or_default();
    view! {
        <fieldset class="panel" id="panel-shelf">
            <legend><h2 class="panel-title">"Keep and share"</h2></legend>
            <div class="field wide" class:invalid=move || form.with(|f| f.problem(Field::Title).is_some())>
                <label for="in-title">"Title (part and point)"</label>
                <input type="text" id="in-title" maxlength="200" autocomplete="off"
                    prop:value=move || form.with(|f| f.title.clone())
                    on:input:target=move |ev| form.update(|f| f.title = ev.target().value())/>
                <span class="field-msg" id="in-title-msg">{text_problem(Field::Title)}</span>
            </div>
            <div class="field wide" class:invalid=move || form.with(|f| f.problem(Field::Note).is_some())>
                <label for="in-note">"Note"</label>
                <textarea id="in-note" rows="2" maxlength="2000"
                    prop:value=move || form.with(|f| f.note.clone())
                    on:input:target=move |ev| form.update(|f| f.note = ev.target().value())></textarea>
                <span class="field-msg" id="in-note-msg">{text_problem(Field::Note)}</span>
            </div>
            <label class="link-row">
                "Link to this case"
                <input type="text" readonly id="case-link" prop:value=move || link.get().unwrap_or_default()/>
            </label>
            <div class="buttons">
                <button type="button" id="copy-link" on:click=copy>"Copy link"</button>
            </div>
            <label class="save-label" for="save-name">"Save under the name"</label>
            <div class="save-row">
                <input type="text" id="save-name" placeholder="default: the title" maxlength="100"
                    prop:value=move || save_name.get() on:input:target=move |ev| save_name.set(ev.target().value())/>
                <button type="button" id="save-case" on:click=save>"Save"</button>
            </div>
            <ul class="saved-list" id="saved-list">{rows}</ul>
            <div class="buttons">
                <button type="button" id="export-cases" on:click=export>"Export all to a file"</button>
                <label class="import">
                    "Import a file "
                    <input type="file" id="import-file" accept="application/json,.json"
                        on:change:target=move |ev| import(ev.target())/>
                </label>
            </div>
            <p class="status" id="shelf-status" role="status">{move || status.get()}</p>
            {move || storage_problem.get().map(|p| view! { <p class="storage-problem" id="storage-problem" role="alert">{format!("Storage: {p}.")}</p> })}
            <p class="hint">"Cases are kept in this browser only (local storage). Links carry the case after #, which is never sent to a server."</p>
        </fieldset>
    }
}
