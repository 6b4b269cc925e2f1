import { httpResource } from '@angular/common/http';
import { computed, Signal } from '@angular/core';
import { Member } from '../projects/project';
import { membersUrl } from '../projects/project-members-api';

/** The project's members, to assign findings to and filter by; empty until loaded. Call in an injection context. */
export function projectPeople(projectId: () => string): Signal<Member[]> {
  const members = httpResource<{ members: Member[] }>(() => {
    const id = projectId();
    return id ? membersUrl(id) : undefined;
  });
  return computed(() => (members.hasValue() ? members.value().members : []));
}
