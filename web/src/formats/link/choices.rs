//! The choice keys of a case link: which a case writes, with their tokens, and reading them back
//! (each optional, defaulting to [`Choices::default`]; one the case's path does not use is
//! refused).

use super::LinkError;
use crate::model::choices::{
    tokens, Choices, Cycle, Endurance, KtFrom, Layout, MaterialPick, NotchQ, Source, MAX_GAUGES,
};
use stresscase_core::material;
use stresscase_core::units::{ForceUnit, LengthUnit, MomentUnit, StrainUnit};
use stresscase_core::vessel::Ends;
use stresscase_core::StressUnit;

/// Choice keys of the source paths, in link order.
pub(super) const CHOICE_KEYS: [&str; 33] = [
    "src", "kind", "lu", "fu", "mu", "pu", "ends", "face", "surf", "layout", "ng", "su", "tsc",
    "cond", "eu", "mat", "msu", "crit", "fat", "cyc", "sem", "fsurf", "fload", "ec", "fcrit",
    "life", "lof", "sn", "msc", "rot", "nq", "skt", "ktf",
];

/// The choice keys a case uses, with their values, in link order.
pub(super) fn choice_pairs(c: &Choices) -> Vec<(&'static str, String)> {
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
            // Written only when a shape is chosen: absent means typed.
            if c.has_loads() && c.kt_from != KtFrom::Typed {
                v.push(("ktf", tokens::token(&tokens::KT_FROM, c.kt_from).into()));
            }
            // Written only when off: absent means on, the meaning of links before it.
            if c.has_loads() && !c.static_kt {
                v.push(("skt", "off".into()));
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
    if c.material == MaterialPick::Own
        || (c.fatigue && c.endurance == Endurance::Given)
        || c.life_strengths()
    {
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
        if c.rotating_shaft() {
            v.push(("rot", "on".into()));
        }
        if c.notch_fatigue() && c.notch_q != NotchQ::Typed {
            v.push(("nq", tokens::token(&tokens::NOTCH_Q, c.notch_q).into()));
        }
        v.push(("life", if c.life { "on" } else { "off" }.into()));
        if c.life {
            v.push(("lof", tokens::token(&tokens::LIFE_OF, c.life_of).into()));
            v.push(("sn", tokens::token(&tokens::SN_FROM, c.sn).into()));
            v.push((
                "msc",
                tokens::token(&tokens::MEAN_STRESS, c.mean_stress).into(),
            ));
        }
    }
    v
}

/// Reads the choice keys (each optional, with the defaults of [`Choices::default`]) and refuses
/// one that the case's path does not use.
pub(super) fn read_choices<'a>(
    take: &impl Fn(&'static str) -> Option<&'a str>,
) -> Result<Choices, LinkError> {
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
        life: pick(
            "life",
            take("life"),
            &[(true, "on"), (false, "off")],
            "on, off",
            d.life,
        )?,
        life_of: pick(
            "lof",
            take("lof"),
            &tokens::LIFE_OF,
            "cycle, history, table",
            d.life_of,
        )?,
        sn: pick("sn", take("sn"), &tokens::SN_FROM, "estimate, f, own", d.sn)?,
        mean_stress: pick(
            "msc",
            take("msc"),
            &tokens::MEAN_STRESS,
            "goodman, gerber, swt, morrow",
            d.mean_stress,
        )?,
        rotating: pick("rot", take("rot"), &[(true, "on")], "on", d.rotating)?,
        notch_q: pick(
            "nq",
            take("nq"),
            &tokens::NOTCH_Q,
            "typed, neuber",
            d.notch_q,
        )?,
        kt_from: pick(
            "ktf",
            take("ktf"),
            &tokens::KT_FROM,
            "typed, shoulder, groove, flat-shoulder, hole",
            d.kt_from,
        )?,
        static_kt: pick("skt", take("skt"), &[(false, "off")], "off", d.static_kt)?,
    };
    if c.fatigue && c.cycle == Cycle::Loads && !c.section_with_loads() {
        return Err(LinkError::BadChoice(
            "cyc",
            "loads".into(),
            "ratio, min, alt (loads needs src=section with a loaded section)",
        ));
    }
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
