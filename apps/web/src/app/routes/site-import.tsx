import { useNavigate, useParams } from 'react-router';
import { Icon } from '@/components/ui/icon';
import { PageHeader } from '@/components/ui/page-header';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';
import { ButtonLink } from '@/components/ui/button';
import { LoadError } from '@/features/assets/components/load-error';
import { paths } from '@/config/paths';
import { useCombinerBoxes } from '@/features/assets/api/get-combiner-boxes';
import { useInverters } from '@/features/assets/api/get-inverters';
import { useModuleModels } from '@/features/assets/api/get-module-models';
import { useSite } from '@/features/assets/api/get-site';
import { LayoutImport } from '@/features/assets/components/layout-import';
import { defaultLibraryListParams } from '@/features/assets/lib/list-params';
import { parseId } from '@/features/assets/lib/parse-id';
import { NotFoundContent } from './not-found';

export function SiteImportRoute() {
  const siteId = parseId(useParams().siteId);
  if (siteId === null) return <NotFoundContent />;
  return <SiteImportPage key={siteId} siteId={siteId} />;
}

/** Import a site's string layout from a CSV: check first, then import all rows at once. */
function SiteImportPage({ siteId }: { siteId: number }) {
  const navigate = useNavigate();
  const site = useSite(siteId);
  // Only to make the example file match this site; the page works without them.
  const inverters = useInverters(siteId);
  const boxes = useCombinerBoxes(siteId);
  const modules = useModuleModels({ ...defaultLibraryListParams, pageSize: 1 });

  if (site.isPending)
    return (
      <LoadingRegion label="Loading the site" className="flex flex-col gap-4">
        <Skeleton className="h-9 w-72" />
        <Skeleton className="h-40 rounded-card" />
        <Skeleton className="h-32 rounded-card" />
      </LoadingRegion>
    );
  if (site.isError) return <LoadError what="site" error={site.error} onRetry={() => void site.refetch()} isRetrying={site.isFetching} backTo={paths.sites()} backLabel="Go to Sites" />;

  const s = site.data;
  const example = {
    inverterTag: inverters.data?.[0]?.tag ?? 'INV01',
    moduleModel: modules.data?.items[0]?.model ?? 'SDM-405-72M',
    combinerTag: boxes.data?.[0]?.tag,
  };

  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2">
        <ButtonLink to={paths.site(s.id)} variant="ghost" className="-ml-4 text-brand">
          <Icon name="chevronLeft" /> {s.name}
        </ButtonLink>
      </nav>
      <PageHeader eyebrow={<span className="readings font-mono">{s.code}</span>} title="Import string layout" description={`Adds strings to ${s.name} from a spreadsheet saved as CSV.`} />
      <LayoutImport site={s} example={example} onCommitted={() => void navigate(paths.site(s.id))} />
    </>
  );
}
