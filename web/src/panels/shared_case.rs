//! The form read as a whole case, once a keystroke, and shared by the parts of the page that
//! need the whole case rather than one field: the section sketch, the scan's chosen point and
//! the case link (the printed sheet and the shelf's copy button); and its choices alone, for
//! the parts that follow only them.

use crate::edge::browser;
use crate::formats::link::Case;
use crate::model::case::CaseForm;
use crate::model::choices::Choices;
use leptos::prelude::*;

/// The form's choices, and the form as a case and its link (`None` while a field does not
/// read).
#[derive(Debug, Clone, Copy)]
pub struct SharedCase {
    /// The choices alone: what follows only them is not re-run as numbers are typed.
    pub choices: Memo<Choices>,
    /// The case, when every field reads.
    pub case: Memo<Option<Case>>,
    /// The page's address with the case's link, when every field reads.
    pub link: Memo<Option<String>>,
}

impl SharedCase {
    /// Reads `form` as a case (once each time it changes) and makes its link.
    #[must_use]
    pub fn new(form: RwSignal<CaseForm>) -> Self {
        let choices = Memo::new(move |_| form.with(|f| f.choices));
        let case = Memo::new(move |_| form.with(|f| Case::from_form(f).ok()));
        let link =
            Memo::new(move |_| case.with(|c| c.as_ref().map(|c| browser::url_with(&c.to_link()))));
        Self {
            choices,
            case,
            link,
        }
    }

    /// The page's shared one (provided by the app), or one of its own for a panel drawn alone.
    #[must_use]
    pub fn of(form: RwSignal<CaseForm>) -> Self {
        use_context::<Self>().unwrap_or_else(|| Self::new(form))
    }
}
