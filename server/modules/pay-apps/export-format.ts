/** `millbrook-commons-pay-app-03-2026-10.pdf`: project, number and the month the period ends in. */
export function exportFileName(projectName: string, number: number, periodEnd: string, ext: 'pdf' | 'csv'): string {
  const slug =
    projectName
      .toLowerCase()
      .normalize('NFKD')
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '')
      .slice(0, 60) || 'project';
  return `${slug}-pay-app-${String(number).padStart(2, '0')}-${periodEnd.slice(0, 7)}.${ext}`;
}
