import { createBrowserRouter, type RouteObject } from 'react-router-dom';
import { Loading } from '../components/ui/loading';
import { meQueryOptions } from '../features/auth/api/get-me';
import { mapLoader } from '../features/map/api/map-loader';
import { patterns } from './paths';
import { queryClient } from './query-client';
import { HomeRoute } from './routes/home-route';
import { NotFoundRoute } from './routes/not-found-route';
import { RouteError } from './routes/route-error';
import { AppShell } from './shell/app-shell';
import { PublicLayout } from './shell/public-layout';

// Pages outside the everyday path load on demand, so a member's phone fetches the member
// table or the mail reader only when a coordinator actually opens them.
const routes: RouteObject[] = [
  {
    id: 'root',
    errorElement: <RouteError />,
    hydrateFallbackElement: <Loading label="Opening Heelwood…" />,
    children: [
      {
        element: <PublicLayout />,
        errorElement: <RouteError />,
        children: [
          {
            path: patterns.signIn,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/sign-in-route')).SignInRoute }),
          },
          {
            path: patterns.signUp,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/sign-up-route')).SignUpRoute }),
          },
          {
            path: patterns.applicationReceived,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/application-received-route')).ApplicationReceivedRoute }),
          },
          {
            path: patterns.forgotPassword,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/forgot-password-route')).ForgotPasswordRoute }),
          },
          {
            path: patterns.resetPassword,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/reset-password-route')).ResetPasswordRoute }),
          },
          { path: '*', element: <NotFoundRoute /> },
        ],
      },
      {
        element: <AppShell />,
        errorElement: <RouteError />,
        // Asks who is signed in at once, while the page's own code is still downloading: the
        // shell cannot draw the page before it knows, so asking later would add a round trip.
        loader: () => {
          void queryClient.prefetchQuery(meQueryOptions());
          return null;
        },
        children: [
          { index: true, element: <HomeRoute />, errorElement: <RouteError /> },
          {
            path: patterns.members,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/members-route')).MembersRoute }),
          },
          {
            path: patterns.mailbox,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/mailbox-route')).MailboxRoute }),
          },
          {
            path: patterns.plants,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/plants-route')).PlantsRoute }),
          },
          {
            path: patterns.plantNew,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/plant-new-route')).PlantNewRoute }),
          },
          {
            path: patterns.plantImport,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/plant-import-route')).PlantImportRoute }),
          },
          {
            path: patterns.plantLabels,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/plant-labels-route')).PlantLabelsRoute }),
          },
          {
            path: patterns.plant,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/plant-route')).PlantRoute }),
          },
          {
            path: patterns.plantEdit,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/plant-edit-route')).PlantEditRoute }),
          },
          {
            path: patterns.plantTrace,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/plant-trace-route')).PlantTraceRoute }),
          },
          {
            path: patterns.plantExposure,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/plant-exposure-route')).PlantExposureRoute }),
          },
          {
            path: patterns.species,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/species-route')).SpeciesRoute }),
          },
          {
            path: patterns.health,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/health-route')).HealthRoute }),
          },
          {
            path: patterns.seasons,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/seasons-route')).SeasonsRoute }),
          },
          {
            path: patterns.season,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/season-route')).SeasonRoute }),
          },
          {
            // Lazy like every page here: the chart library comes with this page only.
            path: patterns.seasonFigures,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/season-figures-route')).SeasonFiguresRoute }),
          },
          {
            path: patterns.figures,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/figures-route')).FiguresRoute }),
          },
          {
            path: patterns.seasonOffers,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/wood-offers-route')).WoodOffersRoute }),
          },
          {
            path: patterns.seasonRequest,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/my-request-route')).MyRequestRoute }),
          },
          {
            path: patterns.seasonBoard,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/wood-board-route')).WoodBoardRoute }),
          },
          {
            path: patterns.planner,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/planner-route')).PlannerRoute }),
          },
          {
            path: patterns.map,
            errorElement: <RouteError />,
            // Static, so the plants are asked for while the map's code is still downloading.
            loader: mapLoader,
            lazy: async () => ({ Component: (await import('./routes/map-route')).MapRoute }),
          },
          {
            path: patterns.seasonRounds,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/season-rounds-route')).SeasonRoundsRoute }),
          },
          {
            path: patterns.round,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/round-route')).RoundRoute }),
          },
          {
            path: patterns.seasonPickups,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/pickups-route')).PickupsRoute }),
          },
          {
            path: patterns.seasonCollections,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/collections-route')).CollectionsRoute }),
          },
          {
            path: patterns.bundleLabels,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/bundle-labels-route')).BundleLabelsRoute }),
          },
          {
            path: patterns.myBundles,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/my-bundles-route')).MyBundlesRoute }),
          },
          {
            path: patterns.strikeRates,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/strike-rates-route')).StrikeRatesRoute }),
          },
        ],
      },
    ],
  },
];

export function createRouter() {
  return createBrowserRouter(routes);
}

export { routes };
