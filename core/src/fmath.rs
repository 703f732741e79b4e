//! The float functions core needs, in one place: the standard library's with the `std` feature,
//! `libm`'s without it. Nothing else in core calls a float function directly.

macro_rules! shim {
    ($(#[$doc:meta] $name:ident($($arg:ident),+))+) => {$(
        #[$doc]
        #[inline]
        #[must_use]
        pub fn $name($($arg: f64),+) -> f64 {
            #[cfg(feature = "std")]
            { f64::$name($($arg),+) }
            #[cfg(not(feature = "std"))]
            { libm::$name($($arg),+) }
        }
    )+};
}

shim! {
    /// Square root.
    sqrt(x)
    /// Sine of an angle in radians.
    sin(x)
    /// Cosine of an angle in radians.
    cos(x)
    /// Four-quadrant arctangent of y/x, in (−π, π].
    atan2(y, x)
    /// Arccosine, in [0, π].
    acos(x)
    /// √(x² + y²) without undue overflow or underflow.
    hypot(x, y)
    /// e to the power x.
    exp(x)
    /// Hyperbolic tangent.
    tanh(x)
    /// Base-10 logarithm.
    log10(x)
    /// Largest integer not above x.
    floor(x)
    /// Smallest integer not below x.
    ceil(x)
}

/// `x` wrapped into [0, period) (the Euclidean remainder, which `core` lacks for floats).
#[inline]
#[must_use]
pub fn wrap(x: f64, period: f64) -> f64 {
    let r = x % period;
    if r < 0.0 {
        r + period
    } else {
        r
    }
}

/// x raised to the power y.
#[inline]
#[must_use]
pub fn powf(x: f64, y: f64) -> f64 {
    #[cfg(feature = "std")]
    {
        f64::powf(x, y)
    }
    #[cfg(not(feature = "std"))]
    {
        libm::pow(x, y)
    }
}
