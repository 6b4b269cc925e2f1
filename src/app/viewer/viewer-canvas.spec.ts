import { TestBed } from '@angular/core/testing';
import { ViewerCanvas } from './viewer-canvas';

describe('ViewerCanvas', () => {
  it('explains that the 3D view needs WebGL 2 where the browser has none (jsdom has none)', async () => {
    // jsdom logs "not implemented" for canvas contexts; that is the situation under test, not a failure.
    const log = jest.spyOn(console, 'error').mockImplementation(() => undefined);
    try {
      const fixture = TestBed.createComponent(ViewerCanvas);
      fixture.componentRef.setInput('glb', '/api/v1/projects/1/models/1/geometry.glb');
      await fixture.whenStable();
      const alert = (fixture.nativeElement as HTMLElement).querySelector('[role="alert"]');
      expect(alert?.textContent).toContain('offers no WebGL 2');
      expect(fixture.componentInstance.engine()).toBeNull();
    } finally {
      log.mockRestore();
    }
  });
});
