import { templateChecks } from '@/shared/analyses';
import { evaluateSheet } from '@/shared/engine/evaluate';
import { squareSailTemplate } from '@/shared/templates';
import { describeTemplateRows, evaluateTemplateSI, siOf } from './template-sheet';

// The engine's P(1 AU) = S0 / c (S0 = 1361 W/m^2, IAU 2015 Resolution B3).
const pressure1au = 1361 / 299_792_458;

describe('attitude-control block of the square-sail template', () => {
  describeTemplateRows(
    'square-sail',
    { cp_offset: 'm', vane_count: '', vane_area: 'm^2', vane_arm: 'm', trim_mass: 'kg', slew_angle: 'deg' },
    { disturbance_torque: 'N m', vane_torque_max: 'N m', trim_travel: 'm', inertia_pitch: 'kg m^2', slew_time: 'h' },
    'these rows',
  );

  // The worked case: 40 m sail, 7.5 um film, 0.1 kg/m booms, four 1 m^2 vanes on 28.8 m arms, eta 0.85.
  const worked = {
    sail_side: 40,
    film_thickness: 7.5,
    boom_linear_density: 100,
    vane_count: 4,
    vane_area: 1,
    vane_arm: 28.8,
    sail_efficiency: 0.85,
    cp_offset: 0.1,
  };

  // Wie 2004, J. Guidance, Control, and Dynamics 27(4) (from memory): one vane gives at most 2 eta P A_v l_v = 0.22 mN m.
  it('gives the most torque one vane can give', () => {
    const values = evaluateTemplateSI('square-sail', worked);
    expect(siOf(values, 'vane_torque_max')).toBeCloseTo(2 * 0.85 * pressure1au * 1 * 28.8, 12);
    expect(siOf(values, 'vane_torque_max') * 1e3).toBeCloseTo(0.22, 2);
  });

  // Wie 2004 (from memory): T_d = F epsilon with F the optical-model force; McInnes 1999 ch. 2 (from memory) for
  // the normal force at zero cone angle, P A [(1 + r s) + B_f (1 - s) r + (1 - r)(eps_f B_f - eps_b B_b)/(eps_f + eps_b)].
  it('gives the disturbance torque of the optical force at the offset', () => {
    const values = evaluateTemplateSI('square-sail', worked);
    const [r, s, ef, eb, bf, bb] = [
      'reflectivity',
      'specular_fraction',
      'emissivity_front',
      'emissivity_back',
      'nonlambertian_front',
      'nonlambertian_back',
    ].map((key) => siOf(values, key)) as [number, number, number, number, number, number];
    const force = pressure1au * 1600 * (1 + r * s + bf * (1 - s) * r + ((1 - r) * (ef * bf - eb * bb)) / (ef + eb));
    expect(siOf(values, 'disturbance_torque')).toBeCloseTo(force * 0.1, 12);
    // About 1.3 mN m: more than four vanes at 0.22 mN m can give back.
    expect(siOf(values, 'disturbance_torque') * 1e3).toBeCloseTo(1.32, 2);
  });

  it('says plainly that small vanes cannot trim a 0.1 m offset, and that they can trim a small one', () => {
    const sheet = squareSailTemplate();
    const [cannot] = templateChecks(sheet, evaluateSheet(sheet, worked));
    expect(cannot).toMatchObject({ role: 'vanes_can_trim', status: 'fails' });
    expect(cannot?.message).toMatch(/^The vanes cannot trim the centre-of-pressure offset/);
    const [can] = templateChecks(sheet, evaluateSheet(sheet, { ...worked, cp_offset: 0.02 }));
    expect(can).toMatchObject({ role: 'vanes_can_trim', status: 'holds' });
  });

  // Centre of mass of two bodies (common practice): moving m_b by dx moves the centre of mass by m_b dx / M.
  it('gives the trim-mass travel that moves the centre of mass by the offset', () => {
    const values = evaluateTemplateSI('square-sail', { ...worked, trim_mass: 2 });
    const shift = (2 * siOf(values, 'trim_travel')) / siOf(values, 'predicted_mass');
    expect(shift).toBeCloseTo(0.1, 12);
  });

  // Wie 2004 (from memory): membrane m s^2 / 12 plus booms (2/3) lambda l^3 about an in-plane diagonal; summed here
  // numerically instead: the square's area elements by their distance to the diagonal, and the two booms across it.
  it('gives the pitch inertia about an in-plane diagonal', () => {
    const values = evaluateTemplateSI('square-sail', worked);
    const membrane = siOf(values, 'membrane_mass');
    const side = 40;
    const cells = 400;
    let plate = 0;
    for (let i = 0; i < cells; i += 1) {
      for (let j = 0; j < cells; j += 1) {
        const [x, y] = [((i + 0.5) / cells - 0.5) * side, ((j + 0.5) / cells - 0.5) * side];
        plate += ((x - y) ** 2 / 2) * (membrane / cells ** 2);
      }
    }
    const boomLength = (side * Math.SQRT2) / 2;
    let booms = 0;
    for (let k = 0; k < 1000; k += 1) booms += 2 * 0.1 * ((k + 0.5) * (boomLength / 1000)) ** 2 * (boomLength / 1000);
    expect(siOf(values, 'inertia_pitch') / (plate + booms)).toBeCloseTo(1, 4);
  });

  // Kinematics of a rest-to-rest bang-bang slew: accelerate through half the angle at T / I, then brake.
  it('gives the bang-bang slew time at the disturbance torque', () => {
    const values = evaluateTemplateSI('square-sail', { ...worked, slew_angle: 30 });
    const acceleration = siOf(values, 'disturbance_torque') / siOf(values, 'inertia_pitch');
    const half = Math.sqrt((2 * (Math.PI / 12)) / acceleration);
    expect(siOf(values, 'slew_time')).toBeCloseTo(2 * half, 6);
  });
});
