//! Units with exact conversion factors: stress, angle, and the length, force, moment and strain
//! units that loads, sections and gauges are entered in.
//!
//! Factors to pascal: kPa 1e3, MPa 1e6, GPa 1e9 (SI prefixes); psi = lbf/in² with
//! 1 lbf = 0.45359237 kg × 9.80665 m/s² = 4.4482216152605 N (exact by definition, NIST SP 811
//! appendix B) and 1 in = 0.0254 m (exact), giving 1 psi = 6894.757293168361 Pa; ksi = 1000 psi.

#[cfg(feature = "serde")]
use serde::{Deserialize, Serialize};

/// Pascals in one pound-force per square inch: 4.4482216152605 N / (0.0254 m)².
pub const PA_PER_PSI: f64 = 4.448_221_615_260_5 / (0.0254 * 0.0254);

/// A unit of stress (force per area).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Default)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
pub enum StressUnit {
    /// pascal, N/m².
    Pa,
    /// kilopascal.
    KPa,
    /// megapascal, N/mm².
    #[default]
    MPa,
    /// gigapascal.
    GPa,
    /// pound-force per square inch.
    Psi,
    /// kilo-pound-force per square inch.
    Ksi,
}

impl StressUnit {
    /// All units, in the order a selector lists them.
    pub const ALL: [StressUnit; 6] = [
        StressUnit::Pa,
        StressUnit::KPa,
        StressUnit::MPa,
        StressUnit::GPa,
        StressUnit::Psi,
        StressUnit::Ksi,
    ];

    /// (base unit in Pa, multiple of the base): SI units are multiples of the pascal, US
    /// customary ones of the psi, so conversions within a family are exact decimal shifts.
    fn base_and_multiple(self) -> (f64, f64) {
        match self {
            Self::Pa => (1.0, 1.0),
            Self::KPa => (1.0, 1e3),
            Self::MPa => (1.0, 1e6),
            Self::GPa => (1.0, 1e9),
            Self::Psi => (PA_PER_PSI, 1.0),
            Self::Ksi => (PA_PER_PSI, 1e3),
        }
    }

    /// Pascals in one of this unit.
    #[must_use]
    pub fn pascals(self) -> f64 {
        let (base, multiple) = self.base_and_multiple();
        base * multiple
    }

    /// The symbol shown beside numbers.
    #[must_use]
    pub fn symbol(self) -> &'static str {
        match self {
            Self::Pa => "Pa",
            Self::KPa => "kPa",
            Self::MPa => "MPa",
            Self::GPa => "GPa",
            Self::Psi => "psi",
            Self::Ksi => "ksi",
        }
    }

    /// Parses a symbol exactly as produced by [`symbol`](Self::symbol).
    #[must_use]
    pub fn from_symbol(s: &str) -> Option<Self> {
        Self::ALL.into_iter().find(|u| u.symbol() == s)
    }

    /// Converts `value` given in `self` to `to`.
    #[must_use]
    pub fn convert(self, value: f64, to: StressUnit) -> f64 {
        let (from_base, from_mult) = self.base_and_multiple();
        let (to_base, to_mult) = to.base_and_multiple();
        if from_base == to_base {
            value * from_mult / to_mult
        } else {
            value * from_mult * from_base / to_base / to_mult
        }
    }
}

/// A unit of angle.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Default)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
pub enum AngleUnit {
    /// degrees, 360 to a turn.
    #[default]
    Degree,
    /// radians, 2π to a turn.
    Radian,
}

impl AngleUnit {
    /// Converts an angle in this unit to radians.
    #[must_use]
    pub fn to_radians(self, value: f64) -> f64 {
        match self {
            Self::Degree => value.to_radians(),
            Self::Radian => value,
        }
    }

    /// Converts an angle in radians to this unit.
    #[must_use]
    pub fn from_radians(self, radians: f64) -> f64 {
        match self {
            Self::Degree => radians.to_degrees(),
            Self::Radian => radians,
        }
    }

    /// The symbol shown beside numbers.
    #[must_use]
    pub fn symbol(self) -> &'static str {
        match self {
            Self::Degree => "°",
            Self::Radian => "rad",
        }
    }
}

/// Metres in one inch (exact by definition, NIST SP 811 appendix B).
pub const M_PER_IN: f64 = 0.0254;
/// Newtons in one pound-force (exact by definition, NIST SP 811 appendix B).
pub const N_PER_LBF: f64 = 4.448_221_615_260_5;

/// A unit of length, for section dimensions and positions.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Default)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
pub enum LengthUnit {
    /// millimetre.
    #[default]
    Mm,
    /// metre.
    M,
    /// inch, 0.0254 m exactly.
    In,
}

impl LengthUnit {
    /// All units, in the order a selector lists them.
    pub const ALL: [LengthUnit; 3] = [LengthUnit::Mm, LengthUnit::M, LengthUnit::In];

    /// Metres in one of this unit.
    #[must_use]
    pub fn metres(self) -> f64 {
        match self {
            Self::Mm => 1e-3,
            Self::M => 1.0,
            Self::In => M_PER_IN,
        }
    }

    /// The symbol shown beside numbers (also the link token).
    #[must_use]
    pub fn symbol(self) -> &'static str {
        match self {
            Self::Mm => "mm",
            Self::M => "m",
            Self::In => "in",
        }
    }

    /// Parses a symbol exactly as produced by [`symbol`](Self::symbol).
    #[must_use]
    pub fn from_symbol(s: &str) -> Option<Self> {
        Self::ALL.into_iter().find(|u| u.symbol() == s)
    }
}

/// A unit of force.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Default)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
pub enum ForceUnit {
    /// newton.
    #[default]
    N,
    /// kilonewton.
    KN,
    /// pound-force, 4.4482216152605 N exactly.
    Lbf,
    /// kip, 1000 lbf.
    Kip,
}

impl ForceUnit {
    /// All units, in the order a selector lists them.
    pub const ALL: [ForceUnit; 4] = [ForceUnit::N, ForceUnit::KN, ForceUnit::Lbf, ForceUnit::Kip];

    /// Newtons in one of this unit.
    #[must_use]
    pub fn newtons(self) -> f64 {
        match self {
            Self::N => 1.0,
            Self::KN => 1e3,
            Self::Lbf => N_PER_LBF,
            Self::Kip => N_PER_LBF * 1e3,
        }
    }

    /// The symbol shown beside numbers (also the link token).
    #[must_use]
    pub fn symbol(self) -> &'static str {
        match self {
            Self::N => "N",
            Self::KN => "kN",
            Self::Lbf => "lbf",
            Self::Kip => "kip",
        }
    }

    /// Parses a symbol exactly as produced by [`symbol`](Self::symbol).
    #[must_use]
    pub fn from_symbol(s: &str) -> Option<Self> {
        Self::ALL.into_iter().find(|u| u.symbol() == s)
    }
}

/// A unit of moment (bending moment or torque).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Default)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
pub enum MomentUnit {
    /// newton metre.
    #[default]
    Nm,
    /// newton millimetre.
    Nmm,
    /// kilonewton metre.
    KNm,
    /// pound-force inch.
    LbfIn,
    /// pound-force foot (12 lbf·in).
    LbfFt,
    /// kip inch.
    KipIn,
}

impl MomentUnit {
    /// All units, in the order a selector lists them.
    pub const ALL: [MomentUnit; 6] = [
        MomentUnit::Nm,
        MomentUnit::Nmm,
        MomentUnit::KNm,
        MomentUnit::LbfIn,
        MomentUnit::LbfFt,
        MomentUnit::KipIn,
    ];

    /// Newton metres in one of this unit.
    #[must_use]
    pub fn newton_metres(self) -> f64 {
        match self {
            Self::Nm => 1.0,
            Self::Nmm => 1e-3,
            Self::KNm => 1e3,
            Self::LbfIn => N_PER_LBF * M_PER_IN,
            Self::LbfFt => N_PER_LBF * M_PER_IN * 12.0,
            Self::KipIn => N_PER_LBF * M_PER_IN * 1e3,
        }
    }

    /// The symbol shown beside numbers.
    #[must_use]
    pub fn symbol(self) -> &'static str {
        match self {
            Self::Nm => "N·m",
            Self::Nmm => "N·mm",
            Self::KNm => "kN·m",
            Self::LbfIn => "lbf·in",
            Self::LbfFt => "lbf·ft",
            Self::KipIn => "kip·in",
        }
    }

    /// The ASCII token used in links and saved cases.
    #[must_use]
    pub fn token(self) -> &'static str {
        match self {
            Self::Nm => "Nm",
            Self::Nmm => "Nmm",
            Self::KNm => "kNm",
            Self::LbfIn => "lbfin",
            Self::LbfFt => "lbfft",
            Self::KipIn => "kipin",
        }
    }

    /// Parses a token as produced by [`token`](Self::token).
    #[must_use]
    pub fn from_token(s: &str) -> Option<Self> {
        Self::ALL.into_iter().find(|u| u.token() == s)
    }
}

/// A unit of strain: dimensionless, or microstrain (1 µε = 1e-6).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Default)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
pub enum StrainUnit {
    /// microstrain, 1e-6.
    #[default]
    Micro,
    /// strain (m/m).
    Unit,
}

impl StrainUnit {
    /// Strain in one of this unit.
    #[must_use]
    pub fn factor(self) -> f64 {
        match self {
            Self::Micro => 1e-6,
            Self::Unit => 1.0,
        }
    }

    /// The symbol shown beside numbers.
    #[must_use]
    pub fn symbol(self) -> &'static str {
        match self {
            Self::Micro => "µε",
            Self::Unit => "m/m",
        }
    }

    /// The ASCII token used in links.
    #[must_use]
    pub fn token(self) -> &'static str {
        match self {
            Self::Micro => "ue",
            Self::Unit => "strain",
        }
    }

    /// Parses a token as produced by [`token`](Self::token).
    #[must_use]
    pub fn from_token(s: &str) -> Option<Self> {
        [Self::Micro, Self::Unit]
            .into_iter()
            .find(|u| u.token() == s)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn psi_factor_is_the_exact_definition() {
        // NIST SP 811 (2008) appendix B.8 lists 1 psi = 6.894 757 E+03 Pa; the exact value follows
        // from the lbf and inch definitions.
        assert_eq!(PA_PER_PSI, 6894.757293168361);
        assert!((StressUnit::Ksi.pascals() - 6894757.293168361).abs() < 1e-8);
    }

    #[test]
    fn conversion_round_trips() {
        for a in StressUnit::ALL {
            for b in StressUnit::ALL {
                let x = 123.456;
                let back = b.convert(a.convert(x, b), a);
                assert!((back - x).abs() <= 1e-12 * x, "{a:?}->{b:?}");
            }
        }
        assert_eq!(StressUnit::MPa.convert(1.0, StressUnit::Pa), 1e6);
        assert_eq!(StressUnit::Ksi.convert(1.0, StressUnit::Psi), 1000.0);
    }

    #[test]
    fn symbols_parse_back() {
        for u in StressUnit::ALL {
            assert_eq!(StressUnit::from_symbol(u.symbol()), Some(u));
        }
        assert_eq!(StressUnit::from_symbol("bar"), None);
    }

    #[test]
    fn angles() {
        assert!((AngleUnit::Degree.to_radians(180.0) - core::f64::consts::PI).abs() < 1e-15);
        assert_eq!(AngleUnit::Radian.from_radians(1.0), 1.0);
    }

    #[test]
    fn load_units_are_the_exact_definitions() {
        // NIST SP 811 (2008) appendix B.8: 1 in = 0.0254 m, 1 lbf = 4.448 222 N (exact values from
        // the definitions), 1 lbf·in = 0.112 984 8 N·m, 1 lbf·ft = 1.355 818 N·m.
        assert_eq!(LengthUnit::In.metres(), 0.0254);
        assert!((ForceUnit::Lbf.newtons() - 4.448222).abs() < 1e-6);
        assert!((MomentUnit::LbfIn.newton_metres() - 0.1129848).abs() < 1e-7);
        assert!((MomentUnit::LbfFt.newton_metres() - 1.355818).abs() < 1e-6);
        // A moment unit is a force unit times a length unit.
        assert_eq!(
            MomentUnit::KipIn.newton_metres(),
            ForceUnit::Kip.newtons() * 0.0254
        );
        for u in MomentUnit::ALL {
            assert_eq!(MomentUnit::from_token(u.token()), Some(u));
        }
        for u in LengthUnit::ALL {
            assert_eq!(LengthUnit::from_symbol(u.symbol()), Some(u));
        }
        for u in ForceUnit::ALL {
            assert_eq!(ForceUnit::from_symbol(u.symbol()), Some(u));
        }
        assert_eq!(StrainUnit::from_token("ue"), Some(StrainUnit::Micro));
    }
}
