import { useNavigate, useParams } from 'react-router-dom';
import { PageHeader, Card } from '../../components/ui/card';
import { ErrorMessage, Notice, Spinner } from '../../components/ui/alert';
import { useMember } from '../../features/productions/hooks/use-member';
import { useBoards } from '../../features/boards/api/get-boards';
import { useCreateBoard } from '../../features/boards/api/create-board';
import { useDeleteBoard } from '../../features/boards/api/delete-board';
import { BoardCard } from '../../features/boards/components/board-card';
import { NewBoardForm } from '../../features/boards/components/new-board-form';
import { useLooks } from '../../features/looks/api/get-looks';
import { useSwatches } from '../../features/swatches/api/get-swatches';
import { mayAddItems, mayChangeDepartmentItem, roleAtLeast } from '../../../shared/policy/department';
import { paths } from '../../lib/paths';

export default function BoardsPage() {
  const pid = Number(useParams().productionId);
  const navigate = useNavigate();
  const { member } = useMember(pid);
  const boards = useBoards(pid);
  const looks = useLooks(pid);
  const swatches = useSwatches(pid);
  const create = useCreateBoard(pid);
  const remove = useDeleteBoard(pid);
  const to = paths.production(pid);

  return (
    <>
      <PageHeader title="Boards" subtitle="Each department's swatches seen through the looks: tones, zones, shifts and merges." />
      {boards.isPending && <Spinner />}
      <ErrorMessage error={boards.error ?? remove.error} />
      <div className="grid gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
        <div className="grid content-start gap-3 sm:grid-cols-2">
          {boards.data?.boards.map((b) => (
            <BoardCard key={b.id} board={b} to={to.board(b.id)} hexOf={(id) => swatches.data?.swatches.find((s) => s.id === id)?.hex}
              onDelete={mayChangeDepartmentItem(member, b.department) ? () => remove.mutate({ pid, id: b.id }) : undefined} />
          ))}
        </div>
        {member && mayAddItems(member) ? (
          <Card>
            <h2 className="mb-3">New board</h2>
            <NewBoardForm myDepartment={member.department} anyDepartment={roleAtLeast(member.role, 'editor')}
              lookIds={(looks.data?.looks ?? []).map((l) => l.id)} swatches={swatches.data?.swatches ?? []} pending={create.isPending} error={create.error}
              onSubmit={(input, onError) => create.mutate({ pid, ...input }, { onSuccess: (r) => navigate(to.board(r.board.id)), onError })} />
          </Card>
        ) : <Notice>Viewers read boards; contributors make them for their own department.</Notice>}
      </div>
    </>
  );
}
