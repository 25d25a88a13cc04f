import type { CareDueList } from './use-cases';

/** The list as JSON: dates stay calendar dates (YYYY-MM-DD) in the site's zone; ids are strings already. */
export function presentCareDue(list: CareDueList) {
  return {
    site: { id: list.site.id, name: list.site.name, timeZone: list.site.timeZone },
    today: list.today,
    items: list.items.map((i) => ({
      kind: i.kind,
      meterRunId: i.meterRunId,
      meterRunName: i.meterRunName,
      transmitterId: i.transmitterId,
      subject: i.subject,
      lastDoneOn: i.lastDoneOn,
      dueOn: i.dueOn,
      state: i.state,
      daysLeft: i.daysLeft,
      recordUrl: i.recordUrl,
      alarmId: i.alarmId,
    })),
  };
}
