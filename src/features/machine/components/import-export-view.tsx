import { EmptyState } from '../../../components/ui/index.ts';

/** Import of a parts list and export of the breakdown (the wizard arrives with the import core). */
export function ImportExportView(_props: { productionId: string; mayEdit: boolean }) {
  return <EmptyState title="Import and export are on their way">Parts lists in CSV or XLSX will be imported here.</EmptyState>;
}
