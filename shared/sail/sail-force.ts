import { checkOptics, type OpticalCoefficients } from '@/shared/sail/optics';
import { radiationPressure } from '@/shared/sail/radiation-pressure';
import { requireInRange, requireNonNegative } from '@/shared/sail/validate';

/**
 * The force on a flat sail split two ways: along the sail normal and in the sail plane
 * (normal, transverse), and along and across the sun line (radial, circumferential).
 * All in newtons. `centreLineAngle` is the angle of the force from the sun line (rad).
 */
export interface SailForceComponents {
  /** Component along the sail normal (N). */
  readonly normal: number;
  /** Component in the sail plane along t̂ = (sin α, −cos α); it has the sign of α (N). */
  readonly transverse: number;
  /** Magnitude of the force (N). */
  readonly magnitude: number;
  /** Component along the sun line, away from the sun (N). */
  readonly radial: number;
  /** Component perpendicular to the sun line, in the plane of sun line and normal; sign of α (N). */
  readonly circumferential: number;
  /** Angle between the force and the sun line, sign of α (rad). */
  readonly centreLineAngle: number;
}

/** How the sail is modelled: ideal flat reflector scaled by an efficiency, or the optical model. */
export type SailForceModel =
  | { readonly kind: 'ideal'; readonly efficiency: number }
  | { readonly kind: 'optical'; readonly optics: OpticalCoefficients };

/** The cone angle range the flat-sail formulas accept: [-π/2, π/2] rad. */
function checkConeAngle(where: string, coneAngle: number): number {
  return requireInRange(where, 'coneAngle', coneAngle, -Math.PI / 2, Math.PI / 2, { unit: 'rad' });
}

function components(normal: number, transverse: number, coneAngle: number): SailForceComponents {
  const cos = Math.cos(coneAngle);
  const sin = Math.sin(coneAngle);
  // With n̂ = (cos α, sin α) and t̂ = (sin α, −cos α) in (radial, circumferential) axes,
  // the sun line's projection on the sail plane is sin α t̂, so a signed α mirrors every component.
  const radial = normal * cos + transverse * sin;
  const circumferential = normal * sin - transverse * cos;
  return {
    normal,
    transverse,
    magnitude: Math.hypot(normal, transverse),
    radial,
    circumferential,
    centreLineAngle: Math.atan2(circumferential, radial),
  };
}

/**
 * Force on an ideal flat sail, F = 2 η P(r) A cos^2 α along the sail normal (McInnes 1999, ch. 2).
 * @param area sail area A (m^2), >= 0
 * @param coneAngle cone (pitch) angle α between sail normal and sun line (rad), in [-π/2, π/2]
 * @param distance heliocentric distance r (m), > 0
 * @param efficiency overall efficiency η, in [0, 1] (0.85–0.9 is common practice); default 1
 * @returns force magnitude (N)
 */
export function idealSailForce(area: number, coneAngle: number, distance: number, efficiency = 1): number {
  const where = 'idealSailForce';
  requireNonNegative(where, 'area', area);
  checkConeAngle(where, coneAngle);
  requireInRange(where, 'efficiency', efficiency, 0, 1);
  const cos = Math.cos(coneAngle);
  return 2 * efficiency * radiationPressure(distance) * area * cos * cos;
}

/**
 * Force on a non-ideal flat sail, optical model (McInnes 1999, ch. 2):
 * F_n = P A [ (1 + r s) cos^2 α + B_f (1 − s) r cos α + (1 − r)(ε_f B_f − ε_b B_b)/(ε_f + ε_b) cos α ],
 * F_t = P A (1 − r s) cos α sin α.
 * @param area sail area A (m^2), >= 0
 * @param coneAngle cone angle α (rad), in [-π/2, π/2]
 * @param distance heliocentric distance r (m), > 0
 * @param optics optical coefficients (dimensionless)
 * @returns the force components (N) and the centre-line angle (rad)
 */
export function opticalSailForce(
  area: number,
  coneAngle: number,
  distance: number,
  optics: OpticalCoefficients,
): SailForceComponents {
  const where = 'opticalSailForce';
  requireNonNegative(where, 'area', area);
  checkConeAngle(where, coneAngle);
  checkOptics(where, optics);
  const { reflectivity: r, specularFraction: s } = optics;
  const { emissivityFront: ef, emissivityBack: eb, nonLambertianFront: bf, nonLambertianBack: bb } = optics;
  const pa = radiationPressure(distance) * area;
  const cos = Math.cos(coneAngle);
  const sin = Math.sin(coneAngle);
  const normal =
    pa *
    ((1 + r * s) * cos * cos + bf * (1 - s) * r * cos + (((1 - r) * (ef * bf - eb * bb)) / (ef + eb)) * cos);
  const transverse = pa * (1 - r * s) * cos * sin;
  return components(normal, transverse, coneAngle);
}

/**
 * Force on a flat sail under either model. The ideal model has no in-plane component.
 * @param model ideal (with efficiency η) or optical (with coefficients)
 * @param area sail area (m^2)
 * @param coneAngle cone angle (rad), in [-π/2, π/2]
 * @param distance heliocentric distance (m)
 * @returns the force components (N) and the centre-line angle (rad)
 */
export function sailForce(
  model: SailForceModel,
  area: number,
  coneAngle: number,
  distance: number,
): SailForceComponents {
  if (model.kind === 'optical') return opticalSailForce(area, coneAngle, distance, model.optics);
  return components(idealSailForce(area, coneAngle, distance, model.efficiency), 0, coneAngle);
}
