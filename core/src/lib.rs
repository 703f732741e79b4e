//! Stress state at one point of a part: the Cauchy stress tensor, its principal values and
//! directions, plane and 3D transformation, Mohr's circles, invariants and equivalent stresses.
//!
//! `no_std` with `alloc`. The `std` feature (default) uses the standard library's float functions;
//! without it they come from `libm` (see [`fmath`]). Every function is unit-agnostic: stresses come
//! out in the unit they went in (invariants in that unit squared or cubed); [`units`] converts.
//!
//! Conventions used throughout (each module states the ones it relies on):
//! - tension positive; τij is the shear on the face with outward normal +i, acting in +j;
//! - angles are radians inside core; a positive angle turns counter-clockwise about +z
//!   (x towards y, z out of the page);
//! - principal stresses are sorted σ1 ≥ σ2 ≥ σ3.
//!
//! Errors are values: constructors validate and return [`StressError`]; nothing here panics on
//! user data.
#![no_std]
#![deny(missing_docs)]

extern crate alloc;

#[cfg(any(feature = "std", test))]
extern crate std;

pub mod concentration;
pub mod criteria;
pub mod critical_plane;
pub mod damage;
pub mod equivalent;
pub mod error;
pub mod fatigue;
pub mod fmath;
pub mod hooke;
pub mod invariants;
pub mod material;
pub mod mean_stress;
pub mod mohr;
pub mod notch;
pub mod points;
pub mod principal;
pub mod rainflow;
pub mod rosette;
pub mod section;
pub mod sn_curve;
pub mod tensor;
pub mod transform;
pub mod units;
pub mod vessel;

pub use equivalent::Equivalent;
pub use error::StressError;
pub use hooke::{Elastic, ElasticError, Strain};
pub use invariants::Invariants;
pub use mohr::{FacePoint, Mohr3d, MohrCircle, PlaneMohr, ShearAxis};

pub use principal::{principal_values, principal_values_into, Principal};
pub use tensor::StressTensor;
pub use transform::{InPlane, PlaneTraction};
pub use units::{AngleUnit, StressUnit};
