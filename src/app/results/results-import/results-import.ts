import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { AbstractControl, FormControl, FormGroup, ReactiveFormsModule, ValidationErrors, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatStepperModule } from '@angular/material/stepper';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { map, Observable, startWith } from 'rxjs';
import { FORCE_UNITS, type ForceUnit, LENGTH_UNITS, type LengthUnit } from '../../../../server/engine/units';
import { MOMENT_UNITS, type MomentUnit } from '../../../../server/results/unit-words';
import { ApiError, errorMessage } from '../../core/api-error';
import { ProjectContext } from '../../projects/project-context';
import {
  columnMappingOf,
  END_COLUMN_KEYS,
  type EndColumnKey,
  MappingFields,
  mappingFieldsFrom,
  mappingProblems,
  MEMBER_KEY_KIND_LABELS,
  resultSetNameFor,
} from '../mapping-fields';
import {
  MappingTemplate,
  mappingTemplatesUrl,
  MemberKeyKind,
  ResultsApi,
  ResultsUpload,
  RowErrors,
  rowErrorsOf,
} from '../results-api';
import { RevisionField } from '../revision-field/revision-field';

const column = () => new FormControl('', { nonNullable: true });

function createMappingForm() {
  return new FormGroup(
    {
      memberColumn: column(),
      memberKeyKind: new FormControl<MemberKeyKind>('auto', { nonNullable: true }),
      combinationColumn: column(),
      stationColumn: column(),
      shearColumn: column(),
      minorShearColumn: column(),
      majorMomentColumn: column(),
      minorMomentColumn: column(),
      forceUnit: new FormControl<ForceUnit | ''>('', { nonNullable: true }),
      lengthUnit: new FormControl<LengthUnit | ''>('', { nonNullable: true }),
      momentUnit: new FormControl<MomentUnit | ''>('', { nonNullable: true }),
      useEnds: new FormControl(false, { nonNullable: true }),
      ends: new FormGroup({ x1: column(), y1: column(), z1: column(), x2: column(), y2: column(), z2: column() }),
    },
    { validators: mappingValidator },
  );
}

function mappingValidator(group: AbstractControl): ValidationErrors | null {
  const problems = mappingProblems(group.getRawValue() as MappingFields);
  return problems.length ? { mapping: problems } : null;
}

/**
 * Imports an analysis export in three steps: the file (and its sheet), the columns and units, then the model
 * revision it belongs to. The server imports all rows or none; refused rows are listed with their row and column.
 */
@Component({
  selector: 'tl-results-import',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    MatStepperModule,
    RevisionField,
  ],
  templateUrl: './results-import.html',
  styleUrl: './results-import.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResultsImport {
  private readonly api = inject(ResultsApi);
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  protected readonly context = inject(ProjectContext);

  protected readonly forceUnits = FORCE_UNITS;
  protected readonly lengthUnits = LENGTH_UNITS;
  protected readonly momentUnits = MOMENT_UNITS;
  /** Columns read besides the web shear (EN 1993 member axes: y-y major, z along the web); none is required. */
  protected readonly optionalColumns: readonly { field: 'minorShearColumn' | 'majorMomentColumn' | 'minorMomentColumn'; label: string }[] = [
    { field: 'minorShearColumn', label: 'Shear across the flanges, Vy (optional)' },
    { field: 'majorMomentColumn', label: 'Moment about the major axis, My (optional)' },
    { field: 'minorMomentColumn', label: 'Moment about the minor axis, Mz (optional)' },
  ];
  protected readonly endKeys = END_COLUMN_KEYS;
  protected readonly keyKinds = Object.entries(MEMBER_KEY_KIND_LABELS) as [MemberKeyKind, string][];

  protected readonly upload = signal<ResultsUpload | null>(null);
  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);
  protected readonly rowErrors = signal<RowErrors | null>(null);

  protected readonly mappingForm = createMappingForm();
  /** Largest distance of an analysis end point from the IFC member axis; blank = the server's default. */
  protected readonly tolerance = new FormControl<number | null>(null, { validators: [Validators.min(0.1), Validators.max(10_000)] });
  protected readonly templateForm = new FormGroup({
    save: new FormControl(false, { nonNullable: true }),
    name: new FormControl('', { nonNullable: true, validators: Validators.maxLength(120) }),
  });
  protected readonly targetForm = new FormGroup({
    modelRevisionId: new FormControl('', { nonNullable: true, validators: Validators.required }),
    name: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(200)] }),
  });

  protected readonly problems = toSignal(
    this.mappingForm.valueChanges.pipe(
      startWith(null),
      map(() => (this.mappingForm.errors?.['mapping'] as string[] | undefined) ?? []),
    ),
    { initialValue: [] },
  );
  protected readonly mappedColumns = toSignal(
    this.mappingForm.valueChanges.pipe(
      startWith(null),
      map(() => columnRoles(this.mappingForm.getRawValue())),
    ),
    { initialValue: new Map<string, string>() },
  );

  protected readonly templates = httpResource<{ templates: MappingTemplate[] }>(() => {
    const id = this.context.projectId();
    return id ? mappingTemplatesUrl(id) : undefined;
  });
  protected readonly templateList = computed(() => (this.templates.hasValue() ? this.templates.value().templates : []));


  protected readonly headers = computed(() => this.upload()?.headers ?? []);
  protected readonly needsSheet = computed(() => (this.upload()?.sheets?.length ?? 0) > 1);
  /** A file is read and, for a workbook, its sheet chosen. */
  protected readonly fileReady = computed(() => {
    const upload = this.upload();
    return upload !== null && (upload.format === 'csv' || upload.sheet !== null);
  });

  protected chooseFile(input: HTMLInputElement): void {
    const file = input.files?.[0];
    input.value = '';
    if (!file) return;
    this.upload.set(null);
    this.run(this.api.upload(this.context.projectId(), file), ({ upload }) => this.showPreview(upload));
  }

  protected chooseSheet(sheet: string): void {
    const upload = this.upload();
    if (!upload) return;
    this.run(this.api.preview(this.context.projectId(), upload.id, sheet), ({ upload: preview }) => this.showPreview(preview));
  }

  protected applyTemplate(template: MappingTemplate): void {
    this.mappingForm.reset(mappingFieldsFrom(template.mapping, this.headers()));
    this.mappingForm.markAllAsTouched();
  }

  protected importResults(): void {
    const upload = this.upload();
    if (!upload || this.mappingForm.invalid || this.targetForm.invalid || this.templateForm.invalid || this.tolerance.invalid) {
      this.targetForm.markAllAsTouched();
      return;
    }
    const { save, name: templateName } = this.templateForm.getRawValue();
    const { modelRevisionId, name } = this.targetForm.getRawValue();
    const mapping = columnMappingOf(this.mappingForm.getRawValue());
    const tolerance_mm = this.tolerance.value;
    this.rowErrors.set(null);
    const request = {
      uploadId: upload.id,
      ...(upload.sheet !== null && { sheet: upload.sheet }),
      mapping,
      modelRevisionId,
      name: name.trim(),
      ...(save && templateName.trim() && { saveTemplateAs: templateName.trim() }),
      ...(mapping.endColumns && tolerance_mm !== null && { geometry: { tolerance_mm } }),
    };
    this.run(this.api.importResults(this.context.projectId(), request), ({ resultSet }) => {
      void this.router.navigate(['..', resultSet.id], { relativeTo: this.route });
    });
  }

  private showPreview(upload: ResultsUpload): void {
    this.upload.set(upload);
    this.rowErrors.set(null);
    this.mappingForm.reset(mappingFieldsFrom(upload.guessedMapping, upload.headers));
    if (!this.targetForm.controls.name.dirty) this.targetForm.controls.name.setValue(resultSetNameFor(upload.fileName));
  }

  private run<T>(request: Observable<T>, done: (result: T) => void): void {
    this.busy.set(true);
    this.failure.set(null);
    request.subscribe({
      next: (result) => {
        this.busy.set(false);
        done(result);
      },
      error: (error: unknown) => {
        this.busy.set(false);
        this.failure.set(errorMessage(error));
        if (error instanceof ApiError && error.code === 'invalid_rows') this.rowErrors.set(rowErrorsOf(error.details));
      },
    });
  }
}

type SingleColumnField = 'memberColumn' | 'combinationColumn' | 'stationColumn' | 'shearColumn' | 'minorShearColumn' | 'majorMomentColumn' | 'minorMomentColumn';

const ROLE_NAMES: Record<SingleColumnField, string> = {
  memberColumn: 'member',
  combinationColumn: 'combination',
  stationColumn: 'station',
  shearColumn: 'shear',
  minorShearColumn: 'Vy',
  majorMomentColumn: 'My',
  minorMomentColumn: 'Mz',
};

/** Header → what it is mapped to, for the labels above the preview's columns. */
function columnRoles(fields: MappingFields): Map<string, string> {
  const roles = new Map<string, string>();
  for (const [field, role] of Object.entries(ROLE_NAMES) as [keyof typeof ROLE_NAMES, string][]) {
    if (fields[field]) roles.set(fields[field], role);
  }
  if (fields.useEnds) for (const key of END_COLUMN_KEYS as readonly EndColumnKey[]) if (fields.ends[key]) roles.set(fields.ends[key], key);
  return roles;
}
