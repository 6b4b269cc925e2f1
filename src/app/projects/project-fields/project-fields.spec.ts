import { createProjectForm, projectDraftOf } from './project-fields';
import { Project } from '../project';

describe('project form', () => {
  it('requires a name and a code, and spaces do not count', () => {
    const form = createProjectForm();
    expect(form.valid).toBe(false);
    form.patchValue({ name: '   ', code: 'DR-01' });
    expect(form.controls.name.hasError('required')).toBe(true);
    form.patchValue({ name: 'Depot roof', code: 'DR-01' });
    expect(form.valid).toBe(true);
  });

  it.each([
    ['longer than 32 characters', 'X'.repeat(33)],
    ['with a space', 'DR 01'],
    ['starting with a dash', '-DR01'],
  ])('rejects a code %s, as the server would', (_case, code) => {
    const form = createProjectForm();
    form.patchValue({ name: 'Depot roof', code });
    expect(form.controls.code.hasError('pattern')).toBe(true);
  });

  it('starts from the project when editing and trims what is sent', () => {
    const project: Project = {
      id: 'p1', name: 'Depot roof', code: 'DR-01', description: '', client: 'Harbour board',
      location: 'Quay 4', standard: 'aisc360-22-asd', archived: false, createdAt: '2026-01-05T10:00:00Z',
    };
    const form = createProjectForm(project);
    form.patchValue({ name: '  Depot roof, phase 2 ' });
    expect(projectDraftOf(form)).toEqual({
      name: 'Depot roof, phase 2', code: 'DR-01', standard: 'aisc360-22-asd',
      client: 'Harbour board', location: 'Quay 4', description: '',
    });
  });
});
