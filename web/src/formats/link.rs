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
//! number, a text with `<script` or `javascript:`, or a link over 32 KiB is refused with
//! a [`LinkError`] naming the problem. Nothing in a link is ever run or inserted as markup.

pub use crate::model::case::Case;
use crate::model::case::{check_text, Mode, MAX_NOTE, MAX_TITLE, ZERO_NORMAL};
use crate::model::choices::{tokens, Choices, Endurance, Layout, MaterialPick, Source, MAX_GAUGES};
use crate::model::inputs::{Num, ELASTIC};
use crate::model::numfmt::write_number;
use core::fmt;
use percent_encoding::{percent_decode_str, utf8_percent_encode, AsciiSet, NON_ALPHANUMERIC};
use std::collections::BTreeMap;
use stresscase_core::material;
use stresscase_core::units::{ForceUnit, LengthUnit, MomentUnit, StrainUnit};
use stresscase_core::vessel::Ends;
use stresscase_core::{AngleUnit, ShearAxis, StressUnit};

/// The link version this release writes.
pub const LINK_VERSION: &str = "1";
/// Longest link accepted, in bytes after `#`. It must hold the longest valid case: a title and
/// note at their limits in 4-byte characters percent-encode to 12 bytes each, plus the numbers.
pub const MAX_LINK_LEN: usize = 32 * 1024;
const _: () = assert!((MAX_TITLE + MAX_NOTE) * 12 + 4096 <= MAX_LINK_LEN);

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

const KEYS: [&str; 15] = [
    "v", "title", "note", "mode", "unit", "sx", "sy", "sz", "txy", "tyz", "tzx", "theta", "au",
    "n", "shear",
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
                (None, true) if ELASTIC.contains(&n) || n == Num::Required => {
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
        })
    }
}

/// Choice keys of the source paths, in link order.
const CHOICE_KEYS: [&str; 25] = [
    "src", "kind", "lu", "fu", "mu", "pu", "ends", "face", "surf", "layout", "ng", "su", "tsc",
    "cond", "eu", "mat", "msu", "crit", "fat", "cyc", "sem", "fsurf", "fload", "ec", "fcrit",
];

/// Every key a v1 link may hold.
fn all_keys() -> Vec<&'static str> {
    let mut k: Vec<&'static str> = KEYS.to_vec();
    k.extend(CHOICE_KEYS);
    k.extend(Num::all().into_iter().map(Num::key));
    k
}

/// The choice keys a case uses, with their values, in link order.
fn choice_pairs(c: &Choices) -> Vec<(&'static str, String)> {
    use crate::model::choices::SectionKind as K;
    let mut v: Vec<(&'static str, String)> = Vec::new();
    match c.source {
        Source::Typed => {}
        Source::Section => {
            v.push(("src", "section".into()));
            v.push(("kind", tokens::token(&tokens::KIND, c.kind).into()));
            v.push(("lu", c.length.symbol().into()));
            if c.has_loads() {
                v.push(("fu", c.force.symbol().into()));
                v.push(("mu", c.moment.token().into()));
            }
            if c.kind != K::Rectangle {
                v.push(("pu", c.pressure.symbol().into()));
            }
            if matches!(c.kind, K::SolidRound | K::Tube | K::ThinCylinder) {
                v.push(("ends", tokens::token(&tokens::ENDS, c.ends).into()));
            }
            if c.kind == K::Rectangle {
                v.push(("face", tokens::token(&tokens::FACE, c.face).into()));
            }
            if matches!(c.kind, K::ThinCylinder | K::ThinSphere) {
                v.push(("surf", tokens::token(&tokens::SURFACE, c.surface).into()));
            }
        }
        Source::Rosette => {
            v.push(("src", "rosette".into()));
            v.push(("layout", tokens::token(&tokens::LAYOUT, c.layout).into()));
            if c.layout == Layout::Custom {
                v.push(("ng", c.gauge_count().to_string()));
            }
            v.push(("su", c.strain_unit.token().into()));
            v.push(("tsc", if c.correct { "on" } else { "off" }.into()));
        }
        Source::Strain => {
            v.push(("src", "strain".into()));
            v.push((
                "cond",
                tokens::token(&tokens::CONDITION, c.condition).into(),
            ));
            v.push(("su", c.strain_unit.token().into()));
        }
    }
    v.push(("eu", c.modulus_unit.symbol().into()));
    v.push((
        "mat",
        match c.material {
            MaterialPick::Own => "own".into(),
            MaterialPick::Table(i) => material::TABLE.get(i).map_or("own", |m| m.key).into(),
        },
    ));
    if c.material == MaterialPick::Own || (c.fatigue && c.endurance == Endurance::Given) {
        v.push(("msu", c.strength_unit.symbol().into()));
    }
    // Written for a built-in material (absent: typed, the meaning of links before this key).
    if c.material != MaterialPick::Own {
        v.push(("ec", tokens::token(&tokens::ELASTIC_FROM, c.elastic).into()));
    }
    v.push((
        "crit",
        tokens::token(&tokens::CRITERION, c.criterion).into(),
    ));
    v.push(("fat", if c.fatigue { "on" } else { "off" }.into()));
    if c.fatigue {
        v.push(("cyc", tokens::token(&tokens::CYCLE, c.cycle).into()));
        v.push(("sem", tokens::token(&tokens::ENDURANCE, c.endurance).into()));
        if c.endurance == Endurance::Estimate {
            v.push(("fsurf", tokens::token(&tokens::FINISH, c.finish).into()));
            v.push(("fload", tokens::token(&tokens::LOADING, c.loading).into()));
        }
        v.push((
            "fcrit",
            tokens::token(&tokens::FATIGUE_CRITERION, c.fatigue_criterion).into(),
        ));
    }
    v
}

/// Reads the choice keys (each optional, with the defaults of [`Choices::default`]) and refuses
/// one that the case's path does not use.
fn read_choices<'a>(take: &impl Fn(&'static str) -> Option<&'a str>) -> Result<Choices, LinkError> {
    fn pick<T: Copy>(
        key: &'static str,
        raw: Option<&str>,
        table: &[(T, &'static str)],
        allowed: &'static str,
        default: T,
    ) -> Result<T, LinkError> {
        raw.map_or(Ok(default), |t| {
            tokens::value(table, t).ok_or_else(|| LinkError::BadChoice(key, t.into(), allowed))
        })
    }
    fn unit<T>(
        key: &'static str,
        raw: Option<&str>,
        parse: impl Fn(&str) -> Option<T>,
        allowed: &'static str,
        default: T,
    ) -> Result<T, LinkError> {
        raw.map_or(Ok(default), |t| {
            parse(t).ok_or_else(|| LinkError::BadChoice(key, t.into(), allowed))
        })
    }
    let d = Choices::default();
    let stress_units = "Pa, kPa, MPa, GPa, psi, ksi";
    let c = Choices {
        source: pick(
            "src",
            take("src"),
            &tokens::SOURCE,
            "typed, section, rosette, strain",
            d.source,
        )?,
        kind: pick(
            "kind",
            take("kind"),
            &tokens::KIND,
            "shaft, tube, rect, thincyl, thinsph",
            d.kind,
        )?,
        length: unit(
            "lu",
            take("lu"),
            LengthUnit::from_symbol,
            "mm, m, in",
            d.length,
        )?,
        force: unit(
            "fu",
            take("fu"),
            ForceUnit::from_symbol,
            "N, kN, lbf, kip",
            d.force,
        )?,
        moment: unit(
            "mu",
            take("mu"),
            MomentUnit::from_token,
            "Nm, Nmm, kNm, lbfin, lbfft, kipin",
            d.moment,
        )?,
        pressure: unit(
            "pu",
            take("pu"),
            StressUnit::from_symbol,
            stress_units,
            d.pressure,
        )?,
        ends: pick(
            "ends",
            take("ends"),
            &tokens::ENDS,
            "closed, open, pstrain",
            d.ends,
        )?,
        face: pick(
            "face",
            take("face"),
            &tokens::FACE,
            "+y, +z, -y, -z",
            d.face,
        )?,
        surface: pick(
            "surf",
            take("surf"),
            &tokens::SURFACE,
            "outer, inner",
            d.surface,
        )?,
        layout: pick(
            "layout",
            take("layout"),
            &tokens::LAYOUT,
            "rect, delta, any",
            d.layout,
        )?,
        gauges: unit(
            "ng",
            take("ng"),
            |t| {
                t.parse::<u8>()
                    .ok()
                    .filter(|n| (3..=MAX_GAUGES).contains(n))
            },
            "3 to 8",
            d.gauges,
        )?,
        strain_unit: unit(
            "su",
            take("su"),
            StrainUnit::from_token,
            "ue, strain",
            d.strain_unit,
        )?,
        correct: pick(
            "tsc",
            take("tsc"),
            &[(true, "on"), (false, "off")],
            "on, off",
            d.correct,
        )?,
        condition: pick(
            "cond",
            take("cond"),
            &tokens::CONDITION,
            "pstress, pstrain, 3d",
            d.condition,
        )?,
        modulus_unit: unit(
            "eu",
            take("eu"),
            StressUnit::from_symbol,
            stress_units,
            d.modulus_unit,
        )?,
        material: unit(
            "mat",
            take("mat"),
            |t| {
                if t == "own" {
                    Some(MaterialPick::Own)
                } else {
                    material::TABLE
                        .iter()
                        .position(|m| m.key == t)
                        .map(MaterialPick::Table)
                }
            },
            "own or a built-in material key",
            d.material,
        )?,
        strength_unit: unit(
            "msu",
            take("msu"),
            StressUnit::from_symbol,
            stress_units,
            d.strength_unit,
        )?,
        criterion: pick(
            "crit",
            take("crit"),
            &tokens::CRITERION,
            "auto, vm, tresca, normal, cm, mm",
            d.criterion,
        )?,
        fatigue: pick(
            "fat",
            take("fat"),
            &[(true, "on"), (false, "off")],
            "on, off",
            d.fatigue,
        )?,
        cycle: pick(
            "cyc",
            take("cyc"),
            &tokens::CYCLE,
            "ratio, min, alt",
            d.cycle,
        )?,
        endurance: pick(
            "sem",
            take("sem"),
            &tokens::ENDURANCE,
            "estimate, given",
            d.endurance,
        )?,
        finish: pick(
            "fsurf",
            take("fsurf"),
            &tokens::FINISH,
            "ground, machined, hotrolled, forged",
            d.finish,
        )?,
        loading: pick(
            "fload",
            take("fload"),
            &tokens::LOADING,
            "bending, axial, torsion",
            d.loading,
        )?,
        elastic: pick(
            "ec",
            take("ec"),
            &tokens::ELASTIC_FROM,
            "mat, typed",
            d.elastic,
        )?,
        fatigue_criterion: pick(
            "fcrit",
            take("fcrit"),
            &tokens::FATIGUE_CRITERION,
            "goodman, gerber, asme, soderberg",
            d.fatigue_criterion,
        )?,
    };
    if c.ends == Ends::PlaneStrain && c.kind == crate::model::choices::SectionKind::ThinCylinder {
        return Err(LinkError::BadChoice(
            "ends",
            "pstrain".into(),
            "closed, open (plane strain is for Lamé cylinders: tube, shaft)",
        ));
    }
    let used = choice_pairs(&c);
    let src = tokens::token(&tokens::SOURCE, c.source);
    for key in CHOICE_KEYS {
        // `src=typed` is never written but means what its absence means.
        let explicit_typed = key == "src" && c.source == Source::Typed;
        if take(key).is_some() && !explicit_typed && !used.iter().any(|(k, _)| *k == key) {
            return Err(LinkError::NotUsed(key, src));
        }
    }
    Ok(c)
}

#[cfg(test)]
mod tests {
    use super::*;
    use proptest::prelude::*;

    #[test]
    fn demo_link_reads_back() {
        let c = Case::demo();
        let link = c.to_link();
        assert!(
            link.starts_with("v=1&title=Demo%20%28invented%29"),
            "{link}"
        );
        assert!(
            link.contains(
                "&mode=plane&unit=MPa&sx=84&sy=-22&txy=37&theta=30&au=deg&n=1,1,1&shear=down"
            ),
            "{link}"
        );
        assert_eq!(Case::from_link(&format!("#{link}")), Ok(c));
    }

    #[test]
    fn the_longest_valid_case_fits_in_a_link() {
        // Found by fuzzing: a note at its limit in non-Latin script once outgrew the link limit.
        let mut c = Case::demo();
        c.mode = Mode::Full;
        c.title = "\u{1F529}".repeat(MAX_TITLE);
        c.note = "\u{1F529}".repeat(MAX_NOTE);
        c.stress = [-1.2345678901234567e-300; 6];
        c.normal = [-2.2250738585072014e-308; 3];
        c.angle = -1.2345678901234567e-300;
        let link = c.to_link();
        assert!(link.len() <= MAX_LINK_LEN, "{}", link.len());
        assert_eq!(Case::from_link(&link), Ok(c.clone()));
        // The paths with the most numbers: an 8-gauge rosette with the correction, and a
        // pressurised tube; both with an own material and a typed fatigue cycle.
        let long = -1.2345678901234567e-300;
        for source in [Source::Rosette, Source::Section] {
            c.mode = Mode::Plane;
            c.stress = [0.0; 6];
            c.choices = Choices {
                source,
                kind: if source == Source::Section {
                    crate::model::choices::SectionKind::Tube
                } else {
                    Choices::default().kind
                },
                layout: if source == Source::Rosette {
                    Layout::Custom
                } else {
                    Choices::default().layout
                },
                gauges: if source == Source::Rosette {
                    MAX_GAUGES
                } else {
                    Choices::default().gauges
                },
                correct: source == Source::Rosette,
                material: MaterialPick::Own,
                fatigue: true,
                cycle: crate::model::choices::Cycle::Minimum,
                endurance: Endurance::Given,
                ..Choices::default()
            };
            c.numbers = c.choices.active().into_iter().map(|n| (n, long)).collect();
            let link = c.to_link();
            assert!(link.len() <= MAX_LINK_LEN, "{source:?}: {}", link.len());
            assert!(
                Case::from_link(&link) == Ok(c.clone()),
                "{source:?} does not read back"
            );
        }
    }

    #[test]
    fn percent_encoded_keys_read_like_plain_ones() {
        let plain = "v=1&mode=plane&unit=MPa&sx=1&sy=2&txy=3";
        let encoded = "%76=1&mode=plane&unit=MPa&%73x=1&sy=2&txy=3";
        assert_eq!(Case::from_link(encoded), Case::from_link(plain));
        let e =
            Case::from_link("v=1&mode=plane&unit=MPa&sx=1&sy=2&txy=3&%3Cimg%20src=1").unwrap_err();
        assert_eq!(e.to_string(), "unknown key '<img src'");
    }

    #[test]
    fn every_link_key_is_distinct() {
        let mut k = all_keys();
        let n = k.len();
        k.sort_unstable();
        k.dedup();
        assert_eq!(k.len(), n, "a key is used twice");
    }

    #[test]
    fn numbers_are_short_and_exact() {
        for v in [
            84.0,
            -35.5,
            1e150,
            -1e-150,
            0.1 + 0.2,
            6894.757293168361,
            5e-324,
            f64::MAX,
        ] {
            let s = write_number(v);
            assert_eq!(s.parse::<f64>().unwrap(), v, "{s}");
            assert!(s.len() <= 24, "{s}");
        }
        assert_eq!(write_number(-0.0), "0");
        assert_eq!(write_number(1e150), "1e150");
    }

    fn arb_text(max: usize) -> impl Strategy<Value = String> {
        proptest::string::string_regex(&format!(
            "[ -~\u{00e9}\u{03c3}\u{2264}\n]{{0,{}}}",
            max.min(60)
        ))
        .unwrap()
        .prop_filter("script-free", move |s| check_text(s, max).is_ok())
    }

    fn arb_num() -> impl Strategy<Value = f64> {
        prop_oneof![
            (-1e4..1e4f64),
            any::<f64>().prop_filter("finite", |v| v.is_finite()),
            Just(0.0),
        ]
    }

    fn arb_choices() -> impl Strategy<Value = Choices> {
        use crate::model::choices::{Condition, Layout, Surface};
        use stresscase_core::section::Face;
        use stresscase_core::vessel::Ends;
        (
            (
                0usize..4,
                0usize..5,
                0usize..3,
                0usize..4,
                0usize..6,
                0usize..6,
            ),
            (any::<bool>(), 0usize..4, any::<bool>(), 0usize..3, 3u8..=8),
            (
                any::<bool>(),
                any::<bool>(),
                0usize..3,
                0usize..6,
                any::<bool>(),
                0usize..4,
            ),
            (
                0usize..=material::TABLE.len(),
                0usize..6,
                0usize..6,
                any::<bool>(),
                0usize..3,
                any::<bool>(),
                0usize..4,
                0usize..3,
            ),
        )
            .prop_map(
                |(
                    (src, kind, lu, fu, mu, pu),
                    (ends, face, surf, layout, ng),
                    (su, tsc, cond, eu, ec, fcrit),
                    (mat, msu, crit, fat, cyc, sem, fin, load),
                )| {
                    Choices {
                        source: tokens::SOURCE[src].0,
                        kind: tokens::KIND[kind].0,
                        length: LengthUnit::ALL[lu],
                        force: ForceUnit::ALL[fu],
                        moment: MomentUnit::ALL[mu],
                        pressure: StressUnit::ALL[pu],
                        ends: if ends {
                            Ends::Closed
                        } else {
                            Ends::PlaneStrain
                        },
                        face: [Face::PosY, Face::PosZ, Face::NegY, Face::NegZ][face],
                        surface: if surf { Surface::Inner } else { Surface::Outer },
                        layout: [Layout::Rectangular, Layout::Delta, Layout::Custom][layout],
                        gauges: ng,
                        strain_unit: if su {
                            StrainUnit::Micro
                        } else {
                            StrainUnit::Unit
                        },
                        correct: tsc,
                        condition: [
                            Condition::PlaneStress,
                            Condition::PlaneStrain,
                            Condition::Full,
                        ][cond],
                        modulus_unit: StressUnit::ALL[eu],
                        material: if mat == material::TABLE.len() {
                            MaterialPick::Own
                        } else {
                            MaterialPick::Table(mat)
                        },
                        strength_unit: StressUnit::ALL[msu],
                        criterion: tokens::CRITERION[crit].0,
                        fatigue: fat,
                        cycle: tokens::CYCLE[cyc].0,
                        endurance: tokens::ENDURANCE[usize::from(sem)].0,
                        finish: tokens::FINISH[fin].0,
                        loading: tokens::LOADING[load].0,
                        elastic: tokens::ELASTIC_FROM[usize::from(ec)].0,
                        fatigue_criterion: tokens::FATIGUE_CRITERION[fcrit].0,
                    }
                },
            )
            .prop_map(|mut c| {
                // Choices a path does not use are not kept in a link: normalise them away.
                let d = Choices::default();
                let used: Vec<&str> = choice_pairs(&c).into_iter().map(|(k, _)| k).collect();
                if !used.contains(&"kind") {
                    c.kind = d.kind;
                }
                if !used.contains(&"lu") {
                    c.length = d.length;
                }
                if !used.contains(&"fu") {
                    c.force = d.force;
                }
                if !used.contains(&"mu") {
                    c.moment = d.moment;
                }
                if !used.contains(&"pu") {
                    c.pressure = d.pressure;
                }
                if !used.contains(&"ends") {
                    c.ends = d.ends;
                }
                if !used.contains(&"face") {
                    c.face = d.face;
                }
                if !used.contains(&"surf") {
                    c.surface = d.surface;
                }
                if !used.contains(&"layout") {
                    c.layout = d.layout;
                }
                if !used.contains(&"ng") {
                    c.gauges = d.gauges;
                }
                if !used.contains(&"su") {
                    c.strain_unit = d.strain_unit;
                }
                if !used.contains(&"tsc") {
                    c.correct = d.correct;
                }
                if !used.contains(&"cond") {
                    c.condition = d.condition;
                }
                if !used.contains(&"msu") {
                    c.strength_unit = d.strength_unit;
                }
                if !used.contains(&"cyc") {
                    c.cycle = d.cycle;
                }
                if !used.contains(&"sem") {
                    c.endurance = d.endurance;
                }
                if !used.contains(&"fsurf") {
                    c.finish = d.finish;
                }
                if !used.contains(&"fload") {
                    c.loading = d.loading;
                }
                if !used.contains(&"ec") {
                    c.elastic = d.elastic;
                }
                if !used.contains(&"fcrit") {
                    c.fatigue_criterion = d.fatigue_criterion;
                }
                if c.kind == crate::model::choices::SectionKind::ThinCylinder {
                    c.ends = Ends::Closed;
                }
                c
            })
    }

    fn arb_case() -> impl Strategy<Value = Case> {
        (
            (
                arb_text(MAX_TITLE),
                arb_text(MAX_NOTE),
                any::<bool>(),
                0usize..6,
            ),
            prop::array::uniform6(arb_num()),
            (
                arb_num(),
                any::<bool>(),
                prop::array::uniform3(arb_num()),
                any::<bool>(),
            ),
            (arb_choices(), prop::collection::vec(arb_num(), 64)),
        )
            .prop_filter_map(
                "non-zero normal",
                |(
                    (title, note, full, u),
                    mut stress,
                    (angle, rad, normal, up),
                    (choices, nums),
                )| {
                    if normal == [0.0; 3] {
                        return None;
                    }
                    let typed = choices.source == Source::Typed;
                    let mode = if full && typed {
                        Mode::Full
                    } else {
                        Mode::Plane
                    };
                    if mode == Mode::Plane {
                        stress[2] = 0.0;
                        stress[4] = 0.0;
                        stress[5] = 0.0;
                    }
                    if !typed {
                        stress = [0.0; 6];
                    }
                    let numbers = choices.active().into_iter().zip(nums).collect();
                    Some(Case {
                        title,
                        note,
                        mode,
                        unit: StressUnit::ALL[u],
                        stress,
                        angle,
                        angle_unit: if rad {
                            AngleUnit::Radian
                        } else {
                            AngleUnit::Degree
                        },
                        normal,
                        shear_axis: if up {
                            ShearAxis::PositiveUp
                        } else {
                            ShearAxis::PositiveDown
                        },
                        choices,
                        numbers,
                    })
                },
            )
    }

    proptest! {
        #[test]
        fn any_case_round_trips_through_its_link(c in arb_case()) {
            let link = c.to_link();
            prop_assert!(link.len() <= MAX_LINK_LEN);
            prop_assert_eq!(Case::from_link(&link), Ok(c.clone()));
            // And through the form the page shows.
            prop_assert_eq!(Case::from_form(&c.to_form()), Ok(c));
        }

        #[test]
        fn any_text_is_refused_or_read_never_panics(s in ".{0,300}") {
            let _ = Case::from_link(&s);
            let _ = Case::from_link(&format!("v=1&{s}"));
        }
    }
}
