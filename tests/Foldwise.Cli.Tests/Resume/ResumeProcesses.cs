namespace Foldwise.Cli.Tests.Resume;

/// <summary>The resume tests start whole searches as child processes: run them one at a time, not against each other on 2 cores.</summary>
[CollectionDefinition(Name)]
public sealed class ResumeProcesses
{
    public const string Name = "resume child processes";
}
