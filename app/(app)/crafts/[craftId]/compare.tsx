import { useLocalSearchParams } from 'expo-router';
import { CompareScreen } from '@/components/compare/compare-screen';
import { PageTitle } from '@/components/ui/page-title';

/** /crafts/:craftId/compare?from=&to=[&output=]: two revisions compared; the search params make it linkable. */
export default function CraftCompareRoute() {
  const { craftId, from, to, output } = useLocalSearchParams<{
    craftId: string;
    from?: string | string[];
    to?: string | string[];
    output?: string | string[];
  }>();
  return (
    <>
      <PageTitle title="Compare" />
      <CompareScreen craftId={craftId} from={from} to={to} output={output} />
    </>
  );
}
