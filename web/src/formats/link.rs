//! Case links: the whole case in the URL fragment (after `#`, so it never reaches a server).
//!
//! Format, version 1 (documented in `docs/case-link-v1.md`; fixtures in
//! `tests/data/case_links_v1.txt` must decode the same in every later release):
//!
//! ```text
//! v=1&title=Lug%20weld&mode=plane&unit=MPa&sx=84&sy=-22&txy=37&theta=30&au=deg&n=1,1,1&shear=down
//! ```
//!
//! `key=value` pairs joined by `&`, `v=1` first. Values are percent-encoded UTF-8. Numbers are
//! written in their shortest form that reads back to the same f64. Keys:
//!
//! | key | value | required |
//! |---|---|---|
//! | `v` | `1` | yes, first |
//! | `title`, `note` | text, ≤ 200 / ≤ 2000 characters | no |
//! | `mode` | `plane` or `3d` | yes |
//! | `unit` | `Pa` `kPa` `MPa` `GPa` `psi` `ksi` | yes |
//! | `sx` `sy` `txy` | numbers | yes |
//! | `sz` `tyz` `tzx` | numbers | in `3d` mode only, and then required |
//! | `theta` | number, in `au` | no (0) |
//! | `au` | `deg` or `rad` | no (`deg`) |
//! | `n` | three numbers, not all zero | no (`1,1,1`) |
//! | `shear` | `down` or `up` | no (`down`) |
//!
//! Keys added later to v1 (all optional, each with a default that leaves older links meaning
//! what they meant): `src` (where the stress comes from), its choices and numbers, and the
//! elastic constants; see the format document. With `src` other than `typed`, `mode` and the
//! stress keys are refused: the tensor is derived.
//!
//! Decoding is strict: an unknown or repeated key, a missing one, a non-number, a non-finite
//! number, a text with `<script` or `javascript:`, or a link over 256 KiB is refused with
//! a [`LinkError`] naming the problem. Nothing in a link is ever run or inserted as markup.

pub use crate::model::case::Case;
use crate::model::case::{check_text, Mode, MAX_NOTE, MAX_TITLE, ZERO_NORMAL};
use crate::model::choices::{tokens, Source};
use crate::model::entry::MAX_HISTORY;
use crate::model::inputs::{Num, ELASTIC};
use crate::model::numfmt::write_number;
use core::fmt;

mod choices;

use choices::{choice_pairs, read_choices, CHOICE_KEYS};
use percent_encoding::{percent_decode_str, utf8_percent_encode, AsciiSet, NON_ALPHANUMERIC};
use std::collections::BTreeMap;
use stresscase_core::{AngleUnit, ShearAxis, StressUnit};

/// The link version this release writes.
pub const LINK_VERSION: &str = "1";
/// Longest link accepted, in bytes after `#`. It must hold the longest valid case: a title and
/// note at their limits in 4-byte characters percent-encode to 12 bytes each, plus the numbers,
/// plus a load history of [`MAX_HISTORY`] values of at most 24 characters and a comma each.
pub const MAX_LINK_LEN: usize = 256 * 1024;
const _: () = assert!((MAX_TITLE + MAX_NOTE) * 12 + 4096 + MAX_HISTORY * 25 <= MAX_LINK_LEN);

/// Characters left as they are in values: letters, digits and `-._~,` (so numbers and lists
/// stay readable).
const VALUE: &AsciiSet = &NON_ALPHANUMERIC
    .remove(b'-')
    .remove(b'.')
    .remove(b'_')
    .remove(b'~')
    .remove(b',');

/// Why a link was refused.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum LinkError {
    /// Nothing after `#`.
    Empty,
    /// Over [`MAX_LINK_LEN`].
    TooLong(usize),
    /// Does not start with `v=`.
    NotACaseLink,
    /// A version this release does not know.
    Version(String),
    /// A part without `=`.
    Malformed(String),
    /// A key v1 does not have.
    UnknownKey(String),
    /// A key given twice.
    Repeated(&'static str),
    /// A required key is absent.
    Missing(&'static str),
    /// A key that the mode does not use (e.g. `sz` in plane mode).
    NotInMode(&'static str),
    /// Not a number.
    NotANumber(&'static str, String),
    /// NaN, infinite, or beyond ±1.8e308.
    NotFinite(&'static str, String),
    /// Not one of the allowed words.
    BadChoice(&'static str, String, &'static str),
    /// Wrong count of numbers in a list.
    Count(&'static str, usize, usize),
    /// The plane normal is (0, 0, 0).
    ZeroNormal,
    /// A text value that is refused, with the reason.
    BadText(&'static str, &'static str),
    /// A key the case's source path does not use.
    NotUsed(&'static str, &'static str),
    /// A load history with too few or too many values.
    HistoryLength(usize),
}

fn shorten(s: &str) -> String {
    let mut out: String = s.chars().take(40).collect();
    if s.chars().count() > 40 {
        out.push('…');
    }
    out
}

impl fmt::Display for LinkError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            Self::Empty => write!(f, "the link holds no case (nothing after #)"),
            Self::TooLong(n) => write!(
                f,
                "the link is {n} characters long; a case link has at most {MAX_LINK_LEN}"
            ),
            Self::NotACaseLink => write!(
                f,
                "this is not a Stresscase case link: it must start with v=1"
            ),
            Self::Version(v) => {
                write!(f, "link version '{}' is not known to this release (it reads version {LINK_VERSION})", shorten(v))
            }
            Self::Malformed(p) => write!(
                f,
                "'{}' is not key=value; the link may be truncated",
                shorten(p)
            ),
            Self::UnknownKey(k) => write!(f, "unknown key '{}'", shorten(k)),
            Self::Repeated(k) => write!(f, "key '{k}' appears more than once"),
            Self::Missing(k) => write!(f, "key '{k}' is missing; the link may be truncated"),
            Self::NotInMode(k) => write!(f, "key '{k}' is only used in 3d mode"),
            Self::NotANumber(k, v) => write!(f, "{k}: '{}' is not a number", shorten(v)),
            Self::NotFinite(k, v) => write!(f, "{k}: '{}' is not a finite number", shorten(v)),
            Self::BadChoice(k, v, allowed) => {
                write!(f, "{k}: '{}' is not one of {allowed}", shorten(v))
            }
            Self::Count(k, want, got) => write!(
                f,
                "{k}: needs {want} numbers separated by commas, found {got}"
            ),
            Self::ZeroNormal => write!(f, "{ZERO_NORMAL}"),
            Self::BadText(k, why) => write!(f, "{k}: {why}"),
            Self::HistoryLength(n) => write!(
                f,
                "hist: a load history has 2 to {MAX_HISTORY} values, found {n}"
            ),
            Self::NotUsed(k, src) => write!(
                f,
                "key '{k}' is not used by this case (src={src} and the choices made)"
            ),
        }
    }
}

fn read_number(key: &'static str, raw: &str) -> Result<f64, LinkError> {
    if raw.is_empty()
        || !raw
            .bytes()
            .all(|b| b.is_ascii_digit() || b"+-.eE".contains(&b))
    {
        return Err(LinkError::NotANumber(key, raw.into()));
    }
    match raw.parse::<f64>() {
        Ok(v) if v.is_finite() => Ok(v),
        Ok(_) => Err(LinkError::NotFinite(key, raw.into())),
        Err(_) => Err(LinkError::NotANumber(key, raw.into())),
    }
}

const KEYS: [&str; 16] = [
    "v", "title", "note", "mode", "unit", "sx", "sy", "sz", "txy", "tyz", "tzx", "theta", "au",
    "n", "shear", "hist",
];

impl Case {
    /// The link text (without `#`).
    #[must_use]
    pub fn to_link(&self) -> String {
        let enc = |s: &str| utf8_percent_encode(s, VALUE).to_string();
        let mut parts = vec![format!("v={LINK_VERSION}")];
        if !self.title.is_empty() {
            parts.push(format!("title={}", enc(&self.title)));
        }
        if !self.note.is_empty() {
            parts.push(format!("note={}", enc(&self.note)));
        }
        let typed = self.choices.source == Source::Typed;
        if typed {
            parts.push(format!(
                "mode={}",
                if self.mode == Mode::Plane {
                    "plane"
                } else {
                    "3d"
                }
            ));
        }
        parts.push(format!("unit={}", self.unit.symbol()));
        if typed {
            let [sx, sy, sz, txy, tyz, tzx] = self.stress.map(write_number);
            parts.push(format!("sx={sx}"));
            parts.push(format!("sy={sy}"));
            if self.mode == Mode::Full {
                parts.push(format!("sz={sz}"));
            }
            parts.push(format!("txy={txy}"));
            if self.mode == Mode::Full {
                parts.push(format!("tyz={tyz}"));
                parts.push(format!("tzx={tzx}"));
            }
        }
        parts.push(format!("theta={}", write_number(self.angle)));
        parts.push(format!(
            "au={}",
            if self.angle_unit == AngleUnit::Degree {
                "deg"
            } else {
                "rad"
            }
        ));
        parts.push(format!("n={}", self.normal.map(write_number).join(",")));
        parts.push(format!(
            "shear={}",
            if self.shear_axis == ShearAxis::PositiveDown {
                "down"
            } else {
                "up"
            }
        ));
        // Keys added to version 1 after its first release come last.
        for (key, value) in choice_pairs(&self.choices) {
            parts.push(format!("{key}={value}"));
        }
        for n in self.choices.active() {
            if let Some(v) = self.numbers.get(&n) {
                parts.push(format!("{}={}", n.key(), write_number(*v)));
            }
        }
        if self.choices.history_on() {
            let values: Vec<String> = self.history.iter().map(|&v| write_number(v)).collect();
            parts.push(format!("hist={}", values.join(",")));
        }
        parts.join("&")
    }

    /// Reads a link (with or without the leading `#`).
    ///
    /// # Errors
    /// The first problem found, naming the key.
    pub fn from_link(raw: &str) -> Result<Self, LinkError> {
        let s = raw.strip_prefix('#').unwrap_or(raw);
        if s.len() > MAX_LINK_LEN {
            return Err(LinkError::TooLong(s.chars().count()));
        }
        if s.trim().is_empty() {
            return Err(LinkError::Empty);
        }
        let known = all_keys();
        let mut values: Vec<Option<String>> = vec![None; known.len()];
        for (i, part) in s.split('&').enumerate() {
            let Some((k, v)) = part.split_once('=') else {
                return Err(if i == 0 {
                    LinkError::NotACaseLink
                } else {
                    LinkError::Malformed(part.into())
                });
            };
            // Browsers may percent-encode any character of the fragment, keys included.
            let k = percent_decode_str(k).decode_utf8_lossy();
            let k = k.as_ref();
            if i == 0 && k != "v" {
                return Err(LinkError::NotACaseLink);
            }
            let Some(slot) = known.iter().position(|&key| key == k) else {
                return Err(LinkError::UnknownKey(k.into()));
            };
            if values[slot].is_some() {
                return Err(LinkError::Repeated(known[slot]));
            }
            let text = percent_decode_str(v)
                .decode_utf8()
                .map_err(|_| LinkError::BadText(known[slot], "is not valid UTF-8 text"))?;
            values[slot] = Some(text.into_owned());
        }
        let take = |key: &'static str| -> Option<&str> {
            known
                .iter()
                .position(|&k| k == key)
                .and_then(|i| values[i].as_deref())
        };
        let required = |key: &'static str| take(key).ok_or(LinkError::Missing(key));
        let version = required("v")?;
        if version != LINK_VERSION {
            return Err(LinkError::Version(version.into()));
        }
        let choices = read_choices(&take)?;
        let typed = choices.source == Source::Typed;
        let src = tokens::token(&tokens::SOURCE, choices.source);
        let mode = if typed {
            match required("mode")? {
                "plane" => Mode::Plane,
                "3d" => Mode::Full,
                other => return Err(LinkError::BadChoice("mode", other.into(), "plane, 3d")),
            }
        } else {
            Mode::Plane
        };
        let unit_text = required("unit")?;
        let unit = StressUnit::from_symbol(unit_text).ok_or_else(|| {
            LinkError::BadChoice("unit", unit_text.into(), "Pa, kPa, MPa, GPa, psi, ksi")
        })?;
        let mut stress = [0.0; 6];
        for (i, key) in ["mode", "sx", "sy", "sz", "txy", "tyz", "tzx"]
            .into_iter()
            .enumerate()
        {
            if !typed {
                if take(key).is_some() {
                    return Err(LinkError::NotUsed(key, src));
                }
                continue;
            }
            if key == "mode" {
                continue;
            }
            let out_of_plane = matches!(key, "sz" | "tyz" | "tzx");
            match (take(key), mode, out_of_plane) {
                (Some(_), Mode::Plane, true) => return Err(LinkError::NotInMode(key)),
                (None, Mode::Plane, true) => {}
                (v, _, _) => {
                    stress[i - 1] = read_number(key, v.ok_or(LinkError::Missing(key))?)?;
                }
            }
        }
        let active = choices.active();
        let mut numbers = BTreeMap::new();
        for n in Num::all() {
            let key = n.key();
            match (take(key), active.contains(&n)) {
                (Some(_), false) => return Err(LinkError::NotUsed(key, src)),
                (Some(v), true) => {
                    numbers.insert(n, read_number(key, v)?);
                }
                // Elastic constants and the required factor came after the first v1 links:
                // absent means the defaults.
                // So did the notch sensitivities: absent means 1 (Kf = Kt, the meaning then).
                (None, true)
                    if ELASTIC.contains(&n) || matches!(n, Num::Required | Num::Q | Num::Qs) =>
                {
                    numbers.insert(n, n.demo_text().parse().unwrap_or(0.0));
                }
                (None, true) if n.is_optional() => {}
                (None, true) => return Err(LinkError::Missing(key)),
                (None, false) => {}
            }
        }
        let angle = take("theta").map_or(Ok(0.0), |v| read_number("theta", v))?;
        let angle_unit = match take("au").unwrap_or("deg") {
            "deg" => AngleUnit::Degree,
            "rad" => AngleUnit::Radian,
            other => return Err(LinkError::BadChoice("au", other.into(), "deg, rad")),
        };
        let normal = match take("n") {
            None => [1.0; 3],
            Some(v) => {
                let parts: Vec<&str> = v.split(',').collect();
                if parts.len() != 3 {
                    return Err(LinkError::Count("n", 3, parts.len()));
                }
                let n = [
                    read_number("n", parts[0])?,
                    read_number("n", parts[1])?,
                    read_number("n", parts[2])?,
                ];
                if n == [0.0; 3] {
                    return Err(LinkError::ZeroNormal);
                }
                n
            }
        };
        let shear_axis = match take("shear").unwrap_or("down") {
            "down" => ShearAxis::PositiveDown,
            "up" => ShearAxis::PositiveUp,
            other => return Err(LinkError::BadChoice("shear", other.into(), "down, up")),
        };
        let title = take("title").unwrap_or("").to_string();
        check_text(&title, MAX_TITLE).map_err(|why| LinkError::BadText("title", why))?;
        let note = take("note").unwrap_or("").to_string();
        check_text(&note, MAX_NOTE).map_err(|why| LinkError::BadText("note", why))?;
        let history = match (take("hist"), choices.history_on()) {
            (Some(_), false) => return Err(LinkError::NotUsed("hist", src)),
            (None, true) => return Err(LinkError::Missing("hist")),
            (None, false) => Vec::new(),
            (Some(v), true) => {
                let values = v
                    .split(',')
                    .map(|x| read_number("hist", x))
                    .collect::<Result<Vec<f64>, _>>()?;
                if !(2..=MAX_HISTORY).contains(&values.len()) {
                    return Err(LinkError::HistoryLength(values.len()));
                }
                values
            }
        };
        Ok(Self {
            title,
            note,
            mode,
            unit,
            stress,
            angle,
            angle_unit,
            normal,
            shear_axis,
            choices,
            numbers,
            history,
        })
    }
}

/// Every key a v1 link may hold.
fn all_keys() -> Vec<&'static str> {
    let mut k: Vec<&'static str> = KEYS.to_vec();
    k.extend(CHOICE_KEYS);
    k.extend(Num::all().into_iter().map(Num::key));
    k
}

#[cfg(test)]
pub(crate) mod tests;
