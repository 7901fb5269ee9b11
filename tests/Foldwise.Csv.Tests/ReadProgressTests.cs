using System.Globalization;
using System.Text;
using Foldwise.Core.Metrics;

namespace Foldwise.Csv.Tests;

public sealed class ReadProgressTests
{
    [Fact]
    public void Tells_the_bytes_read_as_the_rows_pass_and_never_more_than_the_file()
    {
        // Given a 20,000-row table
        var text = new StringBuilder("id,a,b,y\n");
        for (int r = 0; r < 20_000; r++)
        {
            text.Append(CultureInfo.InvariantCulture, $"r{r},{r % 7},{r % 3},{1 + (r % 5)}\n");
        }

        using var csv = new TempCsv(text.ToString());
        var told = new List<(long Done, long Total)>();

        // When it is read with a progress callback
        var table = CsvTableReader.ReadTraining(csv.Path, "id", "y", Metric.Rmsle, bytesRead: (done, total) => told.Add((done, total)));

        // Then the callback was told a few times, with growing positions within the file's length
        long length = new FileInfo(csv.Path).Length;
        Assert.Equal(20_000, table.RowCount);
        Assert.InRange(told.Count, 3, 10);
        Assert.All(told, t => Assert.Equal(length, t.Total));
        Assert.All(told, t => Assert.InRange(t.Done, 1, length));
        Assert.Equal(told.Select(t => t.Done).Order().ToArray(), told.Select(t => t.Done).ToArray());
    }
}
