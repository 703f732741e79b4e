//! Saved cases: a named list kept in the browser's local storage, exported and imported as one
//! JSON file. Schema, version 1 (documented in `docs/saved-cases-v1.md`):
//!
//! ```json
//! { "format": "stresscase-saved-cases", "version": 1,
//!   "cases": [ { "name": "Lug weld, top", "case": "v=1&mode=plane&unit=MPa&sx=84&…" } ] }
//! ```
//!
//! Each `case` is a case link (see [`crate::formats::link`]), so a saved case and a shared link are one
//! format, validated by one decoder. An import is all or nothing: the first bad entry refuses
//! the whole file with its reason, and the list is left as it was.

use crate::formats::link::{Case, LinkError};
use core::fmt;
use serde::{Deserialize, Serialize};

/// The `format` value of a saved-cases file.
pub const FORMAT: &str = "stresscase-saved-cases";
/// The schema version this release writes and reads.
pub const VERSION: u32 = 1;
/// Largest import accepted, in bytes.
pub const MAX_FILE: usize = 4 * 1024 * 1024;
/// Most cases in a list.
pub const MAX_CASES: usize = 1000;
/// Longest name, in characters.
pub const MAX_NAME: usize = 100;

#[derive(Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
struct FileV1 {
    format: String,
    version: u32,
    cases: Vec<Entry>,
}

/// One named case.
#[derive(Debug, Clone, PartialEq, Eq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct Entry {
    /// The name shown in the list; unique within it.
    pub name: String,
    /// The case as a link (without `#`).
    pub case: String,
}

/// Why a file or an operation was refused.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum LibraryError {
    /// Over [`MAX_FILE`].
    TooLarge(usize),
    /// Not JSON of the expected shape.
    NotJson(String),
    /// `format` is not [`FORMAT`].
    WrongFormat(String),
    /// `version` is not one this release reads.
    WrongVersion(u32),
    /// Over [`MAX_CASES`].
    TooMany(usize),
    /// A name is empty, too long, has control characters, or is used twice.
    BadName(usize, &'static str),
    /// A case in the file does not decode.
    BadCase(usize, String, LinkError),
    /// No case at that position.
    NoSuchCase(usize),
}

impl fmt::Display for LibraryError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            Self::TooLarge(n) => write!(
                f,
                "the file is {n} bytes; saved cases files are at most {MAX_FILE}"
            ),
            Self::NotJson(why) => write!(f, "not a saved-cases file: {why}"),
            Self::WrongFormat(s) => {
                let s: String = s.chars().take(40).collect();
                write!(
                    f,
                    "not a saved-cases file (format is '{s}', expected '{FORMAT}')"
                )
            }
            Self::WrongVersion(v) => write!(
                f,
                "saved-cases version {v} is not known to this release (it reads {VERSION})"
            ),
            Self::TooMany(n) => write!(f, "{n} cases is more than the {MAX_CASES} a list can hold"),
            Self::BadName(i, why) => write!(f, "case {}: the name {why}", i + 1),
            Self::BadCase(i, name, e) => {
                let name: String = name.chars().take(40).collect();
                write!(f, "case {} ('{name}'): {e}", i + 1)
            }
            Self::NoSuchCase(i) => write!(f, "there is no saved case {}", i + 1),
        }
    }
}

fn check_name(name: &str) -> Result<(), &'static str> {
    if name.trim().is_empty() {
        Err("is empty")
    } else if name.chars().count() > MAX_NAME {
        Err("is longer than 100 characters")
    } else if name.chars().any(char::is_control) {
        Err("contains control characters")
    } else {
        Ok(())
    }
}

/// The saved cases, always valid: unique good names, every case decodes.
#[derive(Debug, Clone, PartialEq, Eq, Default)]
pub struct Library {
    entries: Vec<Entry>,
}

impl Library {
    /// Reads a saved-cases file, checking everything.
    ///
    /// # Errors
    /// The first problem, naming the case.
    pub fn from_json(text: &str) -> Result<Self, LibraryError> {
        if text.len() > MAX_FILE {
            return Err(LibraryError::TooLarge(text.len()));
        }
        let file: FileV1 =
            serde_json::from_str(text).map_err(|e| LibraryError::NotJson(e.to_string()))?;
        if file.format != FORMAT {
            return Err(LibraryError::WrongFormat(file.format));
        }
        if file.version != VERSION {
            return Err(LibraryError::WrongVersion(file.version));
        }
        if file.cases.len() > MAX_CASES {
            return Err(LibraryError::TooMany(file.cases.len()));
        }
        for (i, e) in file.cases.iter().enumerate() {
            check_name(&e.name).map_err(|why| LibraryError::BadName(i, why))?;
            if file.cases[..i].iter().any(|o| o.name == e.name) {
                return Err(LibraryError::BadName(i, "is used by an earlier case"));
            }
            Case::from_link(&e.case)
                .map_err(|err| LibraryError::BadCase(i, e.name.clone(), err))?;
        }
        Ok(Self {
            entries: file.cases,
        })
    }

    /// The file text (pretty JSON).
    #[must_use]
    pub fn to_json(&self) -> String {
        let file = FileV1 {
            format: FORMAT.into(),
            version: VERSION,
            cases: self.entries.clone(),
        };
        serde_json::to_string_pretty(&file).unwrap_or_default()
    }

    /// The entries, in list order.
    #[must_use]
    pub fn entries(&self) -> &[Entry] {
        &self.entries
    }

    /// The case at `index`.
    ///
    /// # Errors
    /// [`LibraryError::NoSuchCase`], or a decode error (cannot happen for a valid library).
    pub fn case(&self, index: usize) -> Result<Case, LibraryError> {
        let e = self
            .entries
            .get(index)
            .ok_or(LibraryError::NoSuchCase(index))?;
        Case::from_link(&e.case).map_err(|err| LibraryError::BadCase(index, e.name.clone(), err))
    }

    /// Saves `case` under `name`, replacing a case of the same name. Returns its index.
    ///
    /// # Errors
    /// A bad name, or a full list.
    pub fn save(&mut self, name: &str, case: &Case) -> Result<usize, LibraryError> {
        let name = name.trim();
        check_name(name).map_err(|why| LibraryError::BadName(self.entries.len(), why))?;
        let entry = Entry {
            name: name.into(),
            case: case.to_link(),
        };
        if let Some(i) = self.entries.iter().position(|e| e.name == name) {
            self.entries[i] = entry;
            return Ok(i);
        }
        if self.entries.len() >= MAX_CASES {
            return Err(LibraryError::TooMany(self.entries.len() + 1));
        }
        self.entries.push(entry);
        Ok(self.entries.len() - 1)
    }

    /// Renames the case at `index`.
    ///
    /// # Errors
    /// No such case, or a bad or taken name.
    pub fn rename(&mut self, index: usize, name: &str) -> Result<(), LibraryError> {
        let name = name.trim();
        check_name(name).map_err(|why| LibraryError::BadName(index, why))?;
        if self
            .entries
            .iter()
            .enumerate()
            .any(|(i, e)| i != index && e.name == name)
        {
            return Err(LibraryError::BadName(
                index,
                "is already used by another case",
            ));
        }
        let e = self
            .entries
            .get_mut(index)
            .ok_or(LibraryError::NoSuchCase(index))?;
        e.name = name.into();
        Ok(())
    }

    /// Copies the case at `index` under a free name ("… (copy)", "… (copy 2)", …). Returns the
    /// new index.
    ///
    /// # Errors
    /// No such case, or a full list.
    pub fn duplicate(&mut self, index: usize) -> Result<usize, LibraryError> {
        let e = self
            .entries
            .get(index)
            .ok_or(LibraryError::NoSuchCase(index))?
            .clone();
        if self.entries.len() >= MAX_CASES {
            return Err(LibraryError::TooMany(self.entries.len() + 1));
        }
        let name = self.free_name(&format!("{} (copy)", e.name));
        self.entries.insert(index + 1, Entry { name, case: e.case });
        Ok(index + 1)
    }

    /// Removes the case at `index`.
    ///
    /// # Errors
    /// No such case.
    pub fn delete(&mut self, index: usize) -> Result<Entry, LibraryError> {
        if index >= self.entries.len() {
            return Err(LibraryError::NoSuchCase(index));
        }
        Ok(self.entries.remove(index))
    }

    /// Adds every case of `other`, renaming those whose names are taken. Returns how many were
    /// added.
    ///
    /// # Errors
    /// The list would exceed [`MAX_CASES`]; then nothing is added.
    pub fn merge(&mut self, other: Library) -> Result<usize, LibraryError> {
        let total = self.entries.len() + other.entries.len();
        if total > MAX_CASES {
            return Err(LibraryError::TooMany(total));
        }
        let n = other.entries.len();
        for e in other.entries {
            let name = self.free_name(&e.name);
            self.entries.push(Entry { name, case: e.case });
        }
        Ok(n)
    }

    fn free_name(&self, base: &str) -> String {
        let base: String = base.chars().take(MAX_NAME - 6).collect();
        if !self.entries.iter().any(|e| e.name == base) {
            return base;
        }
        (2..)
            .map(|k| format!("{base} ({k})"))
            .find(|n| !self.entries.iter().any(|e| &e.name == n))
            .unwrap_or(base)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn lib_with(names: &[&str]) -> Library {
        let mut l = Library::default();
        for n in names {
            l.save(n, &Case::demo()).unwrap();
        }
        l
    }

    #[test]
    fn export_then_import_is_identity() {
        let l = lib_with(&["Lug weld", "Bracket root", "Σ-check ≤ 200 MPa"]);
        let text = l.to_json();
        assert!(text.contains("\"format\": \"stresscase-saved-cases\""));
        assert_eq!(Library::from_json(&text), Ok(l));
    }

    #[test]
    fn list_operations() {
        let mut l = lib_with(&["A", "B"]);
        assert_eq!(l.duplicate(0), Ok(1));
        assert_eq!(l.entries()[1].name, "A (copy)");
        assert_eq!(l.duplicate(0), Ok(1));
        assert_eq!(l.entries()[1].name, "A (copy) (2)");
        assert!(l.rename(0, "B").is_err());
        l.rename(0, "A2").unwrap();
        assert_eq!(l.delete(0).unwrap().name, "A2");
        assert!(l.delete(10).is_err());
        assert_eq!(l.case(0).unwrap(), Case::demo());
        // Saving under an existing name replaces it.
        let before = l.entries().len();
        l.save("B", &Case::demo()).unwrap();
        assert_eq!(l.entries().len(), before);
    }

    #[test]
    fn merge_renames_clashes() {
        let mut l = lib_with(&["A"]);
        assert_eq!(l.merge(lib_with(&["A", "C"])), Ok(2));
        let names: Vec<_> = l.entries().iter().map(|e| e.name.as_str()).collect();
        assert_eq!(names, ["A", "A (2)", "C"]);
    }

    #[test]
    fn bad_files_are_refused_with_a_reason() {
        let good = Case::demo().to_link();
        let cases = [
            ("", "not a saved-cases file"),
            ("[]", "not a saved-cases file"),
            ("{\"format\":\"other\",\"version\":1,\"cases\":[]}", "format is 'other'"),
            ("{\"format\":\"stresscase-saved-cases\",\"version\":9,\"cases\":[]}", "version 9"),
            ("{\"format\":\"stresscase-saved-cases\",\"version\":1,\"cases\":[],\"extra\":1}", "unknown field"),
            (
                "{\"format\":\"stresscase-saved-cases\",\"version\":1,\"cases\":[{\"name\":\"\",\"case\":\"v=1\"}]}",
                "case 1: the name is empty",
            ),
            (
                "{\"format\":\"stresscase-saved-cases\",\"version\":1,\"cases\":[{\"name\":\"X\",\"case\":\"v=1&mode=plane\"}]}",
                "case 1 ('X'): key 'unit' is missing",
            ),
        ];
        for (text, says) in cases {
            let e = Library::from_json(text).unwrap_err().to_string();
            assert!(e.contains(says), "{text:?}: {e}");
        }
        let dup = format!(
            "{{\"format\":\"stresscase-saved-cases\",\"version\":1,\"cases\":[{{\"name\":\"X\",\"case\":\"{good}\"}},{{\"name\":\"X\",\"case\":\"{good}\"}}]}}"
        );
        assert!(Library::from_json(&dup)
            .unwrap_err()
            .to_string()
            .contains("case 2: the name is used"));
        assert!(matches!(
            Library::from_json(&" ".repeat(MAX_FILE + 1)),
            Err(LibraryError::TooLarge(_))
        ));
    }
}
