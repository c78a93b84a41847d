import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { shareReplay, type Observable } from 'rxjs';
import type {
  AdditionalAllowanceView,
  AmendmentView,
  BuildingAreaTypeView,
  ControlStrategyView,
  EditionSummary,
  EvaluationResult,
  ExteriorApplicationInput,
  ExteriorApplicationRecord,
  ExteriorApplicationView,
  ImportAlias,
  LightingZoneView,
  LuminaireTypeInput,
  LuminaireTypeRecord,
  ProjectDetail,
  ProjectMember,
  ProjectRole,
  ProjectSetupWrite,
  ProvidedControl,
  SpaceInput,
  SpaceRecord,
  SpaceTypeView,
} from '../../core/api/api-types';

/** The parts of an evaluation document that problem paths count through (`spaces.3`, `luminaireTypes.0`, `exterior.applications.2`). */
export interface EvaluationDocumentOrder {
  spaces: { id: string; name: string }[];
  luminaireTypes: { tag: string }[];
  exterior?: { applications: { key: string }[] };
}

/** The project workspace's calls: set-up, design data, results, and the code tables (cached per edition). */
@Injectable({ providedIn: 'root' })
export class WorkspaceApi {
  private readonly http = inject(HttpClient);
  private readonly tableCache = new Map<string, Observable<unknown>>();

  project(projectId: string): Observable<ProjectDetail> {
    return this.http.get<ProjectDetail>(`/api/projects/${projectId}`);
  }

  createProject(setup: ProjectSetupWrite): Observable<ProjectDetail> {
    return this.http.post<ProjectDetail>('/api/projects', setup);
  }

  updateSetup(projectId: string, version: number, changes: Partial<ProjectSetupWrite>): Observable<ProjectDetail> {
    return this.http.patch<ProjectDetail>(`/api/projects/${projectId}`, { ...changes, version });
  }

  members(projectId: string): Observable<ProjectMember[]> {
    return this.http.get<ProjectMember[]>(`/api/projects/${projectId}/members`);
  }

  /** Adds a person with an account by e-mail, or changes their role; answers with the whole team. */
  setMember(projectId: string, email: string, role: ProjectRole): Observable<ProjectMember[]> {
    return this.http.post<ProjectMember[]>(`/api/projects/${projectId}/members`, { email, role });
  }

  removeMember(projectId: string, userId: string): Observable<ProjectMember[]> {
    return this.http.delete<ProjectMember[]>(`/api/projects/${projectId}/members/${userId}`);
  }

  spaces(projectId: string): Observable<SpaceRecord[]> {
    return this.http.get<SpaceRecord[]>(`/api/projects/${projectId}/spaces`);
  }

  createSpace(projectId: string, space: SpaceInput): Observable<SpaceRecord> {
    return this.http.post<SpaceRecord>(`/api/projects/${projectId}/spaces`, space);
  }

  /**
   * One import, all or nothing, with the luminaire types its counts name; a retry with the same
   * `importKey` returns the first import's spaces instead of adding them (and the types) twice.
   */
  createSpaces(
    projectId: string,
    spaces: SpaceInput[],
    importKey: string,
    luminaireTypes: LuminaireTypeInput[] = [],
  ): Observable<SpaceRecord[]> {
    const body = luminaireTypes.length > 0 ? { spaces, luminaireTypes } : { spaces };
    return this.http.post<SpaceRecord[]>(`/api/projects/${projectId}/spaces/bulk`, body, { headers: { 'Idempotency-Key': importKey } });
  }

  /** Names earlier imports matched to a type, remembered for the project. */
  importAliases(projectId: string): Observable<ImportAlias[]> {
    return this.http.get<ImportAlias[]>(`/api/projects/${projectId}/import-aliases`);
  }

  saveImportAliases(projectId: string, aliases: ImportAlias[]): Observable<ImportAlias[]> {
    return this.http.put<ImportAlias[]>(`/api/projects/${projectId}/import-aliases`, { aliases });
  }

  replaceSpace(projectId: string, spaceId: string, version: number, space: SpaceInput): Observable<SpaceRecord> {
    return this.http.put<SpaceRecord>(`/api/projects/${projectId}/spaces/${spaceId}`, { ...space, version });
  }

  patchSpace(projectId: string, spaceId: string, version: number, changes: Partial<SpaceInput>): Observable<SpaceRecord> {
    return this.http.patch<SpaceRecord>(`/api/projects/${projectId}/spaces/${spaceId}`, { ...changes, version });
  }

  deleteSpace(projectId: string, spaceId: string, version: number): Observable<void> {
    return this.http.delete<void>(`/api/projects/${projectId}/spaces/${spaceId}`, { params: { version } });
  }

  /** Brings a deleted space back with its id, values and children. */
  restoreSpace(projectId: string, spaceId: string): Observable<SpaceRecord> {
    return this.http.post<SpaceRecord>(`/api/projects/${projectId}/spaces/${spaceId}/restore`, {});
  }

  luminaireTypes(projectId: string): Observable<LuminaireTypeRecord[]> {
    return this.http.get<LuminaireTypeRecord[]>(`/api/projects/${projectId}/luminaire-types`);
  }

  createLuminaireType(projectId: string, type: LuminaireTypeInput): Observable<LuminaireTypeRecord> {
    return this.http.post<LuminaireTypeRecord>(`/api/projects/${projectId}/luminaire-types`, type);
  }

  replaceLuminaireType(projectId: string, typeId: string, version: number, type: LuminaireTypeInput): Observable<LuminaireTypeRecord> {
    return this.http.put<LuminaireTypeRecord>(`/api/projects/${projectId}/luminaire-types/${typeId}`, { ...type, version });
  }

  deleteLuminaireType(projectId: string, typeId: string, version: number): Observable<void> {
    return this.http.delete<void>(`/api/projects/${projectId}/luminaire-types/${typeId}`, { params: { version } });
  }

  restoreLuminaireType(projectId: string, typeId: string): Observable<LuminaireTypeRecord> {
    return this.http.post<LuminaireTypeRecord>(`/api/projects/${projectId}/luminaire-types/${typeId}/restore`, {});
  }

  exteriorApplications(projectId: string): Observable<ExteriorApplicationRecord[]> {
    return this.http.get<ExteriorApplicationRecord[]>(`/api/projects/${projectId}/exterior-applications`);
  }

  createExteriorApplication(projectId: string, application: ExteriorApplicationInput): Observable<ExteriorApplicationRecord> {
    return this.http.post<ExteriorApplicationRecord>(`/api/projects/${projectId}/exterior-applications`, application);
  }

  replaceExteriorApplication(
    projectId: string,
    applicationId: string,
    version: number,
    application: ExteriorApplicationInput,
  ): Observable<ExteriorApplicationRecord> {
    return this.http.put<ExteriorApplicationRecord>(`/api/projects/${projectId}/exterior-applications/${applicationId}`, {
      ...application,
      version,
    });
  }

  deleteExteriorApplication(projectId: string, applicationId: string, version: number): Observable<void> {
    return this.http.delete<void>(`/api/projects/${projectId}/exterior-applications/${applicationId}`, { params: { version } });
  }

  restoreExteriorApplication(projectId: string, applicationId: string): Observable<ExteriorApplicationRecord> {
    return this.http.post<ExteriorApplicationRecord>(`/api/projects/${projectId}/exterior-applications/${applicationId}/restore`, {});
  }

  /** Records one control (provided, or an exception) on many spaces at once; all or nothing, 409 naming the stale ones. */
  setControlOnSpaces(
    projectId: string,
    spaces: readonly Pick<SpaceRecord, 'id' | 'version'>[],
    control: ProvidedControl,
  ): Observable<SpaceRecord[]> {
    return this.http.post<SpaceRecord[]>(`/api/projects/${projectId}/spaces/controls`, {
      spaces: spaces.map(({ id, version }) => ({ id, version })),
      control,
    });
  }

  /** The stored project as the evaluation reads it: the order its problem paths count in. */
  document(projectId: string): Observable<EvaluationDocumentOrder> {
    return this.http.get<EvaluationDocumentOrder>(`/api/projects/${projectId}/document`);
  }

  results(projectId: string): Observable<EvaluationResult> {
    return this.http.get<EvaluationResult>(`/api/projects/${projectId}/results`);
  }

  editions(): Observable<EditionSummary[]> {
    return this.cached('editions', '/api/code-editions');
  }

  spaceTypes(edition: string): Observable<SpaceTypeView[]> {
    return this.cached(`${edition}/space-types`, `/api/code-editions/${edition}/space-types`);
  }

  buildingAreaTypes(edition: string): Observable<BuildingAreaTypeView[]> {
    return this.cached(`${edition}/building-area-types`, `/api/code-editions/${edition}/building-area-types`);
  }

  controlStrategies(edition: string): Observable<ControlStrategyView[]> {
    return this.cached(`${edition}/control-strategies`, `/api/code-editions/${edition}/control-strategies`);
  }

  exteriorApplicationTypes(edition: string): Observable<ExteriorApplicationView[]> {
    return this.cached(`${edition}/exterior-applications`, `/api/code-editions/${edition}/exterior-applications`);
  }

  lightingZones(edition: string): Observable<LightingZoneView[]> {
    return this.cached(`${edition}/lighting-zones`, `/api/code-editions/${edition}/lighting-zones`);
  }

  amendments(edition: string): Observable<AmendmentView[]> {
    return this.cached(`${edition}/amendments`, `/api/code-editions/${edition}/amendments`);
  }

  additionalAllowances(edition: string): Observable<AdditionalAllowanceView[]> {
    return this.cached(`${edition}/additional-allowances`, `/api/code-editions/${edition}/additional-allowances`);
  }

  /** Code tables change only with a new data version, so one request per page load is enough. */
  private cached<T>(key: string, url: string): Observable<T> {
    let request = this.tableCache.get(key) as Observable<T> | undefined;
    if (!request) {
      request = this.http.get<T>(url).pipe(shareReplay({ bufferSize: 1, refCount: false }));
      this.tableCache.set(key, request);
    }
    return request;
  }
}
