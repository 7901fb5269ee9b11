/// <summary>A table given as two CSV files (--train, --test) with its id and target columns, instead of the demo.</summary>
internal sealed record CsvPair(string Train, string Test, string Id, string Target);
