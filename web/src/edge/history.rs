//! When an edit becomes a browser-history entry. The URL always shows the current case, but a
//! new entry is made only when an edit starts after a pause, so Back steps through settled
//! states instead of keystrokes. Time is passed in, so this is tested without a browser.

/// A pause this long (ms) ends a burst of edits.
pub const SETTLE_MS: f64 = 1200.0;

/// What to do with the browser history for an edit.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum HistoryAction {
    /// The case did not change.
    Nothing,
    /// Start a new entry (`pushState`).
    Push,
    /// Update the current entry (`replaceState`).
    Replace,
}

/// Tracks the case in the URL and when it last changed.
#[derive(Debug, Clone, PartialEq)]
pub struct HistoryPolicy {
    current: String,
    last_edit: Option<f64>,
}

impl HistoryPolicy {
    /// Starts with the link the page opened with.
    #[must_use]
    pub fn new(initial: String) -> Self {
        Self {
            current: initial,
            last_edit: None,
        }
    }

    /// The link now in the URL.
    #[must_use]
    pub fn current(&self) -> &str {
        &self.current
    }

    /// An edit produced `link` at time `now_ms`.
    pub fn on_edit(&mut self, now_ms: f64, link: &str) -> HistoryAction {
        if link == self.current {
            return HistoryAction::Nothing;
        }
        let in_burst = self.last_edit.is_some_and(|t| now_ms - t < SETTLE_MS);
        self.last_edit = Some(now_ms);
        self.current = link.to_string();
        if in_burst {
            HistoryAction::Replace
        } else {
            HistoryAction::Push
        }
    }

    /// The user went back or forward (or pasted a link) to `link`: it is current, and the next
    /// edit starts a new entry.
    pub fn on_navigate(&mut self, link: &str) {
        self.current = link.to_string();
        self.last_edit = None;
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_burst_of_keystrokes_is_one_entry() {
        let mut h = HistoryPolicy::new("a".into());
        assert_eq!(h.on_edit(0.0, "b"), HistoryAction::Push);
        assert_eq!(h.on_edit(100.0, "bc"), HistoryAction::Replace);
        assert_eq!(h.on_edit(900.0, "bcd"), HistoryAction::Replace);
        assert_eq!(h.on_edit(950.0, "bcd"), HistoryAction::Nothing);
        // After a pause the next edit is a new entry.
        assert_eq!(h.on_edit(900.0 + SETTLE_MS, "e"), HistoryAction::Push);
    }

    #[test]
    fn navigation_resets_the_burst() {
        let mut h = HistoryPolicy::new("a".into());
        h.on_edit(0.0, "b");
        h.on_navigate("a");
        assert_eq!(h.current(), "a");
        assert_eq!(h.on_edit(10.0, "c"), HistoryAction::Push);
    }
}
