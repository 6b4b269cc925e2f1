import { HttpTestingController } from '@angular/common/http/testing';
import { nextRequest, settle } from '../../core/http.testing';
import { TEST_PROJECT_ID } from '../../core/session.testing';
import { configureProjectPagesForTests, openProjectSection } from '../../projects/project.testing';
import { MemberSheet } from '../checks-api';
import { memberSheet } from '../checks.testing';
import { familySheet } from './family-sheet.testing';

const GLOBAL_ID = '2O2Fr$t4X7Zf8NOew3FLOH';
const sheetApi = `/api/projects/${TEST_PROJECT_ID}/checks/run-1/members/${encodeURIComponent(GLOBAL_ID)}/sheet`;

describe('CalculationSheet', () => {
  let backend: HttpTestingController;

  beforeEach(() => {
    backend = configureProjectPagesForTests();
  });

  afterEach(() => backend.verify());

  async function open(sheet: MemberSheet): Promise<HTMLElement> {
    const harness = await openProjectSection('engineer', `checks/run-1/members/${encodeURIComponent(GLOBAL_ID)}`);
    (await nextRequest(backend, sheetApi)).flush(sheet);
    await settle();
    return harness.routeNativeElement!.querySelector<HTMLElement>('tl-calculation-sheet')!;
  }

  it('draws the section to scale beside τ(y), with the same paper height', async () => {
    const page = await open(memberSheet());
    const section = page.querySelector<SVGElement>('svg.section-drawing')!;
    const plot = page.querySelector<SVGElement>('svg.stress-plot')!;
    expect(section.getAttribute('aria-label')).toBe('Section IPE 300 drawn to scale 1:2.5');
    expect(section.getAttribute('height')).toBe(plot.getAttribute('height'));
    const labels = [...section.querySelectorAll('.dimension text')].map((text) => text.textContent!.trim());
    expect(labels).toEqual(['d = 300', 'b = 150', 'tf = 10.7', 'tw = 7.1', 'r = 15']);
    expect(plot.querySelectorAll('.jump')).toHaveLength(2);
    expect([...plot.querySelectorAll('.mark text')].map((text) => text.textContent!.trim().split(' = ')[0])).toEqual(['V/(hw·tw)', 'fy/(√3·γM0)']);
    expect(plot.querySelector('.peak text')!.textContent).toContain('τmax =');
  });

  it('shows the trace, every combination with the governing one marked, the suggestion and the cautions', async () => {
    const page = await open(memberSheet());
    expect(page.querySelector('h1')!.textContent).toContain('G-101');
    const trace = [...page.querySelectorAll('.trace tbody tr')].map((row) => row.querySelector('td')!.textContent!.trim());
    expect(trace).toEqual(['EN 1993-1-1 §6.2.6(3)', 'EN 1993-1-1 (6.18)']);
    const governing = page.querySelector('.combinations tr.governing')!;
    expect(governing.textContent).toContain('ULS-2');
    expect(governing.textContent).toContain('112.5 %');
    expect(page.querySelector('.suggestion')!.textContent).toContain('8.2 mm');
    expect(page.querySelector('tl-cautions-notice')!.textContent).toContain('engineer of record');
    // The product cautions are in the panel; the sheet adds nothing of its own here.
    expect(page.querySelector('.member-cautions')).toBeNull();
  });

  it('says why a member was not checked and draws nothing it cannot', async () => {
    const page = await open(
      memberSheet({ status: 'not-checked', reason: 'No shear results were matched to this member.', section: null, stress: null, governing: null, trace: [], combinations: [], suggestion: null }),
    );
    expect(page.querySelector('svg')).toBeNull();
    expect(page.querySelector('.facts')!.textContent).toContain('No shear results were matched to this member.');
    expect(page.querySelector('.trace')!.textContent).toContain('No trace');
  });

  it('lists what the sheet adds for this member, such as a changed engine', async () => {
    const changed = 'The engine has changed since this run.';
    const page = await open(memberSheet({ engineVersion: { run: 'engine-old', sheet: 'engine-test' }, cautions: [changed, ...memberSheet().cautions] }));
    expect(page.querySelector('.member-cautions')!.textContent).toContain(changed);
    expect(page.querySelector('.facts')!.textContent).toContain('this sheet engine-test');
  });

  it('draws a box with its void from its outline, dimensioned in AISC notation, beside τ with both flange jumps', async () => {
    const box = familySheet({ family: 'box', depth_mm: 300, width_mm: 200, webThickness_mm: 10, flangeThickness_mm: 16 }, 'aisc360-22-lrfd');
    const page = await open(box);
    const outline = page.querySelector('svg.section-drawing path.outline')!;
    expect(outline.getAttribute('fill-rule')).toBe('evenodd');
    expect(outline.getAttribute('d')!.match(/M/g)).toHaveLength(2);
    expect([...page.querySelectorAll('svg.section-drawing .dimension text')].map((text) => text.textContent!.trim())).toEqual(['H = 300', 'B = 200', 'tw = 10', 'tf = 16']);
    expect(page.querySelector('svg.stress-plot .peak text')!.textContent).toContain('τmax =');
    expect(page.querySelectorAll('svg.stress-plot .jump')).toHaveLength(2);
    expect(page.querySelector('.trace')!.textContent).toContain('G4');
  });

  it('draws a tube as a ring, dimensioned in EN notation, at the height of its τ plot', async () => {
    const tube = familySheet({ family: 'tube', diameter_mm: 219.1, wallThickness_mm: 8 }, 'en1993-1-1');
    const page = await open(tube);
    const outline = page.querySelector('svg.section-drawing path.outline')!;
    expect(outline.getAttribute('d')!.match(/M/g)).toHaveLength(2);
    expect([...page.querySelectorAll('svg.section-drawing .dimension text')].map((text) => text.textContent!.trim())).toEqual(['d = 219.1', 't = 8']);
    expect(page.querySelector('svg.section-drawing')!.getAttribute('height')).toBe(page.querySelector('svg.stress-plot')!.getAttribute('height'));
  });
});
