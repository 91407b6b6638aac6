import { Op } from 'sequelize';
import { PropertySet, Material, User } from '../models';
import { Project } from '../models/projects';
import { DEMO_CAMERA, DEMO_CHAMBER_PORT, DEMO_HULL, DEMO_VIEWPORT } from '../../../shared/demo-load-cases';
import { addMember, createLoadCase, createProject } from '../../modules/projects/service';
import { addItem, createShortlist } from '../../modules/projects/shortlists';
import { checkShortlist, submitShortlist } from '../../modules/projects/shortlist-steps';
import type { Actor } from '../../modules/projects/access';

/**
 * The Harrow Sound demo (invented): Harrow Sound Marine Works' two-person research submersible
 * rated to 1,200 m, its 4,000 m survey camera housing and its 5 bar treatment chamber, with the load
 * cases of shared/demo-load-cases.ts. Built through the same services the API uses, so the design
 * record is a real one.
 */

async function publishedSet(family: string, condition: RegExp): Promise<number> {
  const sets = await PropertySet.findAll({ where: { status: 'published' }, include: [{ model: Material, as: 'material', where: { family } }], order: [['id', 'ASC']] });
  const match = sets.find((s) => condition.test(s.condition)) ?? sets[0];
  if (!match) throw new Error(`demo seed: no published ${family} set`);
  return match.id;
}

export async function seedDemoProject(): Promise<boolean> {
  if ((await Project.count()) > 0) return false;
  const byRole = async (role: string): Promise<Actor & { name: string }> => {
    const u = await User.findOne({ where: { email: { [Op.eq]: `${role}@harrow.example` } } });
    if (!u) throw new Error(`demo seed: ${role}@harrow.example is missing`);
    return { id: u.id, name: u.name, role: u.role };
  };
  const engineer = await byRole('engineer');
  const checker = await byRole('checker');
  const viewer = await byRole('viewer');

  const sub = await createProject(engineer, {
    name: 'HS-2 research submersible (1,200 m)',
    description: 'Harrow Sound Marine Works: two-person research submersible rated to 1,200 m. Forward viewport and pressure hull.',
  });
  await addMember(engineer, sub.id, checker.id);
  await addMember(engineer, sub.id, viewer.id);
  const viewport = await createLoadCase(engineer, sub.id, {
    name: 'Forward viewport, 90° cone at 1,200 m',
    loadCase: DEMO_VIEWPORT,
    filters: { transparent: true },
    notes: 'Seat of the forward hatch; minor diameter fixed by the camera field of view.',
  });
  const hull = await createLoadCase(engineer, sub.id, {
    name: 'Pressure hull, sphere at 1,200 m',
    loadCase: DEMO_HULL,
    filters: { transparent: false },
    notes: 'Crew sphere, 1.6 m inside diameter; penetrations checked separately.',
  });

  const acrylicMin = await publishedSet('acrylic', /PVHO-grade cast sheet, as supplied/i);
  const acrylicTyp = await publishedSet('acrylic', /temperature/i);
  const checked = await createShortlist(engineer, sub.id, { loadCaseId: viewport.id, name: 'Viewport window material' });
  await addItem(engineer, checked.id, { propertySetId: acrylicMin, note: 'Lot-certified minimums of the pressure-window standard; the basis for the certified design.' });
  const filled = await addItem(engineer, checked.id, { propertySetId: acrylicTyp, note: 'Typical values with creep and temperature data; confirm with the supplier for the actual lot.' });
  const submitted = await submitShortlist(engineer, checked.id, filled.lockVersion);
  await checkShortlist(checker, checked.id, submitted.lockVersion, 'Agreed: cast acrylic to the standard minimums; confirm seat geometry against the standard tables.');

  const open = await createShortlist(engineer, sub.id, { loadCaseId: hull.id, name: 'Crew sphere hull material' });
  await addItem(engineer, open.id, { propertySetId: await publishedSet('titanium-alloy', /AMS 4911|annealed/i), note: 'Preferred: weight to displacement.' });
  await addItem(engineer, open.id, { propertySetId: await publishedSet('steel', /HY-80|HY80/i), note: 'Fallback if titanium plate lead time is too long.' });

  const camera = await createProject(engineer, {
    name: 'Survey camera housing (4,000 m)',
    description: 'Pressure housing for the camera of a 4,000 m survey vehicle.',
  });
  await addMember(engineer, camera.id, checker.id);
  await createLoadCase(engineer, camera.id, { name: 'Housing tube between end caps', loadCase: DEMO_CAMERA, filters: { transparent: false }, notes: '' });

  const chamber = await createProject(engineer, {
    name: 'Treatment chamber TC-5 (5 bar)',
    description: 'Hyperbaric treatment chamber with flat viewports, 5 bar working pressure.',
  });
  await addMember(engineer, chamber.id, checker.id);
  await createLoadCase(engineer, chamber.id, { name: 'Flat side viewport, 250 mm clear', loadCase: DEMO_CHAMBER_PORT, filters: { transparent: true }, notes: '' });
  return true;
}
