# Multi-stage build of the plandesk command (CLI and target service) for linux-x64.
FROM mcr.microsoft.com/dotnet/sdk:10.0 AS build
WORKDIR /src
COPY . .
RUN dotnet publish src/PlanDesk.Cli/PlanDesk.Cli.csproj -c Release -r linux-x64 --self-contained false -o /app

FROM mcr.microsoft.com/dotnet/aspnet:10.0
WORKDIR /app
COPY --from=build /app .
COPY networks /app/networks
# The embedded store lives in /data; mount a volume there to keep it.
VOLUME /data
EXPOSE 5080
ENTRYPOINT ["dotnet", "/app/plandesk.dll"]
CMD ["serve", "--data-dir", "/data", "--urls", "http://0.0.0.0:5080"]
