import type { BoardCar, BoardResult, ClassBoard } from '@shared/collab/team.schema';
import { recordPath } from '@/config/record-paths';

/** On the class board's address: show that one event, every team driver in each class ranked in one list. */
export const EVENT_PARAM = 'event';

/** The whole class board for a season. */
export function seasonBoardPath(teamId: string, season: number): string {
  return `${recordPath.classBoard(teamId)}?${new URLSearchParams({ season: String(season) }).toString()}`;
}

/** One event of the class board: `/teams/:teamId/board?season=2026&event=:eventId`. */
export function eventBoardPath(teamId: string, season: number, eventId: string): string {
  return `${recordPath.classBoard(teamId)}?${new URLSearchParams({ season: String(season), [EVENT_PARAM]: eventId }).toString()}`;
}

/** One event of the season on the board. */
export interface BoardEvent {
  eventId: string;
  eventName: string;
  date: string;
}

/** One driver's day in one car at the event. */
export interface EventLine {
  car: BoardCar['car'];
  result: BoardResult;
  /** Another line in the class has the same rank. */
  tied: boolean;
}

/** One class at the event: every team car's drivers there, in the order of the board's ranking. */
export interface EventClass {
  classCode: string;
  factor: number | null;
  lines: EventLine[];
}

const byEvent = (a: BoardEvent, b: BoardEvent) =>
  a.date.localeCompare(b.date) || a.eventName.localeCompare(b.eventName) || a.eventId.localeCompare(b.eventId);

/** The season's events with a team result, in the board's order: by date, then name. */
export function boardEvents(board: ClassBoard): BoardEvent[] {
  const seen = new Map<string, BoardEvent>();
  for (const group of board.classes) {
    for (const car of group.cars) {
      for (const r of car.results) if (!seen.has(r.eventId)) seen.set(r.eventId, { eventId: r.eventId, eventName: r.eventName, date: r.date });
    }
  }
  return [...seen.values()].sort(byEvent);
}

/** The events either side of one in the season: null at either end, or when it is not on the board. */
export function neighbourEvents(board: ClassBoard, eventId: string): { previous: BoardEvent | null; next: BoardEvent | null } {
  const events = boardEvents(board);
  const at = events.findIndex((e) => e.eventId === eventId);
  if (at === -1) return { previous: null, next: null };
  return { previous: events[at - 1] ?? null, next: events[at + 1] ?? null };
}

/**
 * One event, class by class. The order is the board's own rank in class (the server ranks once: a line
 * ahead of another is strictly faster, equal times share a rank); lines without a time (all DNF or off
 * course) have no rank and come last. Classes without a line at the event are left out.
 */
export function eventClasses(board: ClassBoard, eventId: string): EventClass[] {
  const classes: EventClass[] = [];
  for (const group of board.classes) {
    const lines = group.cars.flatMap((car) => car.results.filter((r) => r.eventId === eventId).map((result) => ({ car: car.car, result })));
    if (lines.length === 0) continue;
    lines.sort(
      (a, b) =>
        (a.result.rankInClass ?? Infinity) - (b.result.rankInClass ?? Infinity) ||
        a.result.driver.displayName.localeCompare(b.result.driver.displayName) ||
        a.car.name.localeCompare(b.car.name),
    );
    classes.push({
      classCode: group.classCode,
      factor: group.factor,
      lines: lines.map((line) => ({
        ...line,
        tied: line.result.rankInClass !== null && lines.some((other) => other !== line && other.result.rankInClass === line.result.rankInClass),
      })),
    });
  }
  return classes;
}

/** How many runs the driver made that day and how the ones without a time ended: "4 runs, 1 DNF". */
export function runsWords(runs: BoardResult['runs']): string {
  const total = runs.finished + runs.dnf + runs.offCourse;
  const parts = [`${total} ${total === 1 ? 'run' : 'runs'}`];
  if (runs.dnf > 0) parts.push(`${runs.dnf} DNF`);
  if (runs.offCourse > 0) parts.push(`${runs.offCourse} off course`);
  return parts.join(', ');
}
