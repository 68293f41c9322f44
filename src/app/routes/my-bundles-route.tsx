import { useQueryClient } from '@tanstack/react-query';
import { plannerKeys } from '../../features/planner/api/keys';
import { plantKeys } from '../../features/plants/api/keys';
import { MyBundlesPage } from '../../features/strike-reports/components/my-bundles';

export function MyBundlesRoute() {
  const queryClient = useQueryClient();
  return (
    <>
      <title>My bundles · Heelwood</title>
      <MyBundlesPage
        // A report moves the planner's strike rates; raised plants join the register.
        onReportsChanged={() => void queryClient.invalidateQueries({ queryKey: plannerKeys.all })}
        onPlantsRaised={() => void queryClient.invalidateQueries({ queryKey: plantKeys.all })}
      />
    </>
  );
}
