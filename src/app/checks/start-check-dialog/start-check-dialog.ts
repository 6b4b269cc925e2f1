import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, effect, inject, signal, untracked } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { FormArray, FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialogModule, MatDialogRef, MAT_DIALOG_DATA } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { GradeId } from '../../../../server/engine/grades';
import { ApiError, errorMessage } from '../../core/api-error';
import { StandardId, STANDARDS } from '../../projects/project';
import { ResultSet, resultsUrl, revisionsUrl } from '../../results/results-api';
import { RevisionField } from '../../results/revision-field/revision-field';
import { CheckRun, ChecksApi } from '../checks-api';
import {
  checkParametersOf,
  CheckParameterFields,
  Fabrication,
  gradesFor,
  ProjectSettings,
  recommendedFields,
} from '../check-parameter-fields';

export interface StartCheckData {
  projectId: string;
  standard: StandardId;
  /** The project's check defaults, when the project answer carries them. */
  settings?: Partial<ProjectSettings>;
}

type OverrideGroup = FormGroup<{ profile: FormControl<string>; fabrication: FormControl<Fabrication> }>;

function overrideGroup(profile = '', fabrication: Fabrication = 'welded'): OverrideGroup {
  return new FormGroup({
    profile: new FormControl(profile, { nonNullable: true, validators: Validators.required }),
    fabrication: new FormControl<Fabrication>(fabrication, { nonNullable: true }),
  });
}

const factor = (min: number, max: number) => [Validators.required, Validators.min(min), Validators.max(max)];
const optionalFactor = (min: number, max: number) => [Validators.min(min), Validators.max(max)];

/** Starts a check run: which revision and results, which standard, and the parameters with recommended values. */
@Component({
  selector: 'tl-start-check-dialog',
  imports: [ReactiveFormsModule, MatButtonModule, MatDialogModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, RevisionField],
  templateUrl: './start-check-dialog.html',
  styleUrl: './start-check-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StartCheckDialog {
  private readonly api = inject(ChecksApi);
  private readonly dialogRef = inject<MatDialogRef<StartCheckDialog, CheckRun>>(MatDialogRef);
  protected readonly data = inject<StartCheckData>(MAT_DIALOG_DATA);

  protected readonly standards = STANDARDS;

  protected readonly resultSets = httpResource<{ resultSets: ResultSet[] }>(() => resultsUrl(this.data.projectId));
  protected readonly resultSetList = computed(() => (this.resultSets.hasValue() ? this.resultSets.value().resultSets : []));

  private readonly initial = recommendedFields(this.data.standard, this.data.settings);
  protected readonly form = new FormGroup({
    modelRevisionId: new FormControl('', { nonNullable: true, validators: Validators.required }),
    resultSetId: new FormControl('', { nonNullable: true, validators: Validators.required }),
    standard: new FormControl<StandardId>(this.data.standard, { nonNullable: true }),
    defaultGrade: new FormControl<GradeId>(this.initial.defaultGrade, { nonNullable: true }),
    warningPercent: new FormControl(this.initial.warningPercent, { nonNullable: true, validators: factor(1, 100) }),
    stiffenerSpacing_mm: new FormControl<number | null>(null, { validators: Validators.min(1) }),
    gammaM0: new FormControl(this.initial.gammaM0, { nonNullable: true, validators: factor(1, 1.5) }),
    gammaM1: new FormControl(this.initial.gammaM1, { nonNullable: true, validators: factor(1, 1.5) }),
    eta: new FormControl<number | null>(this.initial.eta, { validators: optionalFactor(1, 1.2) }),
    yieldRule: new FormControl(this.initial.yieldRule, { nonNullable: true }),
    endPost: new FormControl(this.initial.endPost, { nonNullable: true }),
    phiV: new FormControl<number | null>(null, { validators: optionalFactor(0.01, 1) }),
    omegaV: new FormControl<number | null>(null, { validators: optionalFactor(1, 3) }),
    fabricationOverrides: new FormArray<OverrideGroup>([]),
  });

  protected readonly standard = toSignal(this.form.controls.standard.valueChanges, { initialValue: this.data.standard });
  protected readonly grades = computed(() => gradesFor(this.standard()));
  private readonly revisionId = toSignal(this.form.controls.modelRevisionId.valueChanges, { initialValue: '' });

  /** Profiles of the chosen revision, for the fabrication overrides. */
  protected readonly facets = httpResource<{ profiles: string[] }>(() => {
    const revisionId = this.revisionId();
    return revisionId ? `${revisionsUrl(this.data.projectId)}/${encodeURIComponent(revisionId)}/members/facets` : undefined;
  });
  protected readonly profiles = computed(() => (this.facets.hasValue() ? this.facets.value().profiles : []));

  private readonly resultSetId = toSignal(this.form.controls.resultSetId.valueChanges, { initialValue: '' });
  protected readonly chosenSet = computed(() => this.resultSetList().find((set) => set.id === this.resultSetId()) ?? null);
  /** The chosen results were matched against another revision than the one chosen here. */
  protected readonly otherRevision = computed(() => {
    const set = this.chosenSet();
    return set !== null && this.revisionId() !== '' && set.modelRevisionId !== this.revisionId();
  });

  protected readonly saving = signal(false);
  protected readonly failure = signal<string | null>(null);
  /** The server's warning that almost nothing in the results matches the model; running needs a second, explicit yes. */
  protected readonly poorMatch = signal<string | null>(null);

  constructor() {
    effect(() => {
      const revisionId = this.revisionId();
      const sets = this.resultSetList();
      untracked(() => this.pickResultSet(revisionId, sets));
    });
    const destroyRef = inject(DestroyRef);
    // A grade of the other family makes no sense after a change of standard.
    this.form.controls.standard.valueChanges.pipe(takeUntilDestroyed(destroyRef)).subscribe((standard) => {
      if (!gradesFor(standard).includes(this.form.controls.defaultGrade.value)) {
        this.form.controls.defaultGrade.setValue(recommendedFields(standard, this.data.settings).defaultGrade);
      }
    });
    // The warning was about the inputs as they were; any change asks the server again.
    this.form.valueChanges.pipe(takeUntilDestroyed(destroyRef)).subscribe(() => this.poorMatch.set(null));
  }

  protected addOverride(): void {
    this.form.controls.fabricationOverrides.push(overrideGroup());
  }

  protected removeOverride(index: number): void {
    this.form.controls.fabricationOverrides.removeAt(index);
  }

  /** Once a revision is chosen, the newest results imported for it (or the newest of all), unless the user chose. */
  private pickResultSet(revisionId: string, sets: readonly ResultSet[]): void {
    const set = this.form.controls.resultSetId;
    if (set.value || !revisionId) return;
    const choice = sets.find((candidate) => candidate.modelRevisionId === revisionId) ?? sets[0];
    if (choice) set.setValue(choice.id);
  }

  protected startCheck(confirmPoorMatch = false): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const value = this.form.getRawValue();
    const fields: CheckParameterFields = value;
    this.saving.set(true);
    this.failure.set(null);
    this.api
      .start(this.data.projectId, {
        modelRevisionId: value.modelRevisionId,
        resultSetId: value.resultSetId,
        standard: value.standard,
        parameters: checkParametersOf(value.standard, fields),
        ...(confirmPoorMatch && { confirmPoorMatch: true }),
      })
      .subscribe({
        next: ({ run }) => this.dialogRef.close(run),
        error: (error: unknown) => {
          this.saving.set(false);
          if (error instanceof ApiError && error.code === 'poor_match') this.poorMatch.set(error.message);
          else this.failure.set(errorMessage(error));
        },
      });
  }
}
