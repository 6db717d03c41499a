import { useForm } from 'react-hook-form';
import { Button } from '../../../components/Button';
import { ErrorNote } from '../../../components/ErrorNote';
import { useCreateUpload, type UploadInput } from '../api/create-upload';

type FormValues = Omit<UploadInput, 'file'> & { file: FileList };

const field = 'mt-1 block w-full rounded-md border border-graphite-300 bg-white px-2 py-1.5 text-sm';

/** Chooses the file and how to read it, and sends it for a dry run (nothing is stored yet). */
export function UploadForm({ onChecked }: { onChecked: (id: number) => void }) {
  const { register, handleSubmit, formState: { errors } } = useForm<FormValues>({ defaultValues: { format: 'long', delimiter: 'semicolon', decimal: ',' } });
  const upload = useCreateUpload();
  const submit = handleSubmit(({ file, ...options }) => {
    upload.mutate({ ...options, file: file[0] }, { onSuccess: (report) => onChecked(report.id) });
  });
  return (
    <form onSubmit={submit} className="grid gap-3 rounded-md border border-paper-300 bg-white p-4 sm:grid-cols-4" aria-label="Upload results">
      <label className="text-sm font-medium sm:col-span-4">
        CSV or XLSX file
        <input type="file" accept=".csv,.tsv,.txt,.xlsx" className={field} {...register('file', { validate: (files) => files.length === 1 || 'Choose one file.' })} />
        {errors.file ? <span className="text-xs text-fail-ink">{errors.file.message}</span> : null}
      </label>
      <label className="text-sm font-medium">
        Layout
        <select className={field} {...register('format')}>
          <option value="long">Long: a row per measurement</option>
          <option value="wide">Wide: a row per run</option>
        </select>
      </label>
      <label className="text-sm font-medium">
        Field delimiter (CSV)
        <select className={field} {...register('delimiter')}>
          <option value="semicolon">Semicolon ;</option>
          <option value="comma">Comma ,</option>
          <option value="tab">Tab</option>
        </select>
      </label>
      <label className="text-sm font-medium">
        Decimal separator
        <select className={field} {...register('decimal')}>
          <option value=",">Comma (0,123)</option>
          <option value=".">Point (0.123)</option>
        </select>
      </label>
      <div className="flex items-end">
        <Button type="submit" disabled={upload.isPending}>{upload.isPending ? 'Checking…' : 'Check file (dry run)'}</Button>
      </div>
      {upload.error ? <div className="sm:col-span-4"><ErrorNote error={upload.error} title="The file was not checked" /></div> : null}
    </form>
  );
}
