import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import { useNavigate } from "react-router-dom";
import { z } from "zod";
import { channelNameSchema } from "@shared/auth/schemas";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { PageHeader } from "../../../components/PageHeader";
import { useCreateChannel } from "../api/create-channel";
import { TextField } from "../../../components/form-fields";

const schema = z.object({ name: channelNameSchema });

export function NewChannelPage() {
  const create = useCreateChannel();
  const navigate = useNavigate();
  const form = useForm<{ name: string }>({ resolver: zodResolver(schema), defaultValues: { name: "" } });
  const onSubmit = form.handleSubmit(async (values) => {
    const channel = await create.mutateAsync(values).catch(() => null);
    if (channel) navigate(`/c/${channel.id}/home`);
  });
  return (
    <div className="mx-auto max-w-lg">
      <PageHeader title="New channel" subtitle="You'll be its owner. Episodes, members and sponsors stay inside it." />
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4 rounded-lg border border-ply-300 bg-white p-6">
        {create.isError && <Notice kind="error">{create.error.message}</Notice>}
        <TextField label="Channel name" autoFocus {...form.register("name")} error={form.formState.errors.name?.message} />
        <Button type="submit" busy={create.isPending}>
          Create channel
        </Button>
      </form>
    </div>
  );
}
